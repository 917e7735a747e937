// Plain wording for input errors, the same in the browser and on the server. A schema's own message
// wins; this speaks for the rest. The API puts the field's path in front ("supply.voltageRms: …").
import { z } from 'zod';
// Imported by every shared schema and by the server's routing, so it is in force on every route.

type Issue = z.core.$ZodRawIssue;

const n = (v: unknown) => (typeof v === 'bigint' ? v.toString() : String(v));
const what = (origin: unknown) => (origin === 'string' ? ' characters' : origin === 'array' || origin === 'set' ? ' entries' : '');

function typeWord(expected: unknown): string {
  switch (expected) {
    case 'number': return 'a number';
    case 'int': return 'a whole number';
    case 'string': return 'text';
    case 'boolean': return 'true or false';
    case 'array': return 'a list';
    case 'object': return 'a set of fields';
    case 'date': return 'a date';
    default: return `of type ${n(expected)}`;
  }
}

export function plainMessage(issue: Issue): string | undefined {
  const i = issue as Issue & Record<string, unknown>;
  switch (i.code) {
    case 'invalid_type':
      return i.input === undefined ? 'is required' : `must be ${typeWord(i.expected)}`;
    case 'too_big':
      if (i.origin === 'string' || i.origin === 'array' || i.origin === 'set') return `must have at most ${n(i.maximum)}${what(i.origin)}`;
      return i.inclusive === false ? `must be less than ${n(i.maximum)}` : `must be at most ${n(i.maximum)}`;
    case 'too_small':
      if (i.origin === 'string' && Number(i.minimum) === 1) return 'must not be empty';
      if (i.origin === 'string' || i.origin === 'array' || i.origin === 'set') return `must have at least ${n(i.minimum)}${what(i.origin)}`;
      return i.inclusive === false ? `must be more than ${n(i.minimum)}` : `must be at least ${n(i.minimum)}`;
    case 'invalid_value':
      return Array.isArray(i.values) ? `must be one of: ${i.values.map(n).join(', ')}` : undefined;
    case 'invalid_union':
      return 'does not match any of the accepted forms';
    case 'unrecognized_keys':
      return Array.isArray(i.keys) ? `has fields that are not accepted: ${i.keys.join(', ')}` : undefined;
    case 'not_multiple_of':
      return `must be a multiple of ${n(i.divisor)}`;
    default:
      return undefined;
  }
}

z.config({ customError: plainMessage });
