import fc from 'fast-check';
import type { ZodType } from 'zod';
import { HOSTILE_NUMBERS, HOSTILE_TEXT, hostile } from './hostile-values.js';

/** Where real values come from: ids of the right kind (by field name), the signer's password. */
export interface Pools {
  idFor: (field: string) => fc.Arbitrary<string>;
  password: string;
}

type Def = { type: string; [k: string]: any };
const defOf = (s: ZodType): Def => (s as any)._zod.def;
const checksOf = (d: Def) => (d.checks ?? []).map((c: any) => c._zod.def);

const TEXT = ['Ok', 'Zoë Brandt', 'Bench 4 isolation check', 'Step one: switch off and lock the isolator.', 'Tomasz Wójcik (LEJ)'];
const DATES = ['2026-03-02', '2025-06-01', '2026-02-28', '2024-02-29', '1900-01-01', '2199-12-31'];
const MOMENTS = ['2026-03-05T14:30:00Z', '2026-03-01T10:00:00+01:00', '1900-01-01T00:00:00Z'];

// A text or number field gets the right type with a hostile value now and then: what a loose schema lets through.
const text = (field: string, d: Def, pools: Pools) =>
  fc.oneof({ weight: 3, arbitrary: validText(field, d, pools) }, { weight: 1, arbitrary: fc.constantFrom(...HOSTILE_TEXT) });
const number = (d: Def) => fc.oneof({ weight: 3, arbitrary: validNumber(d) }, { weight: 1, arbitrary: fc.constantFrom(...HOSTILE_NUMBERS) });

function validText(field: string, d: Def, pools: Pools): fc.Arbitrary<string> {
  if (/password/i.test(field)) return fc.constant(pools.password);
  if (/timeZone/.test(field)) return fc.constantFrom('Europe/Berlin', 'America/New_York');
  if (d.format === 'uuid') return pools.idFor(field);
  if (d.format === 'email') return fc.constantFrom('someone.new@example.test', 'manager@demo.breakover.test');
  if (d.format === 'datetime') return fc.constantFrom(...MOMENTS);
  const checks = checksOf(d);
  const regex = checks.find((c: any) => c.format === 'regex')?.pattern as RegExp | undefined;
  if (regex?.source === '^\\d{4}-\\d{2}-\\d{2}$') return fc.constantFrom(...DATES);
  if (regex) return fc.stringMatching(regex, { maxLength: 24 }).map((v) => v.trim());
  const min = checks.find((c: any) => c.check === 'min_length')?.minimum ?? 0;
  const max = checks.find((c: any) => c.check === 'max_length')?.maximum ?? 200;
  const fits = TEXT.filter((v) => v.length >= min && v.length <= max);
  return fits.length ? fc.constantFrom(...fits) : fc.constant('x'.repeat(Math.min(min, max)));
}

function validNumber(d: Def): fc.Arbitrary<number> {
  const checks = checksOf(d);
  const lo = checks.find((c: any) => c.check === 'greater_than')?.value ?? -1000;
  const hi = checks.find((c: any) => c.check === 'less_than')?.value ?? 1000;
  const int = checks.some((c: any) => c.check === 'number_format');
  return int ? fc.integer({ min: Math.ceil(lo), max: Math.floor(hi) }) : fc.double({ min: lo, max: hi, noNaN: true, noDefaultInfinity: true });
}

/** Values shaped like the schema's input, now and then the whole value or one of its parts swapped for a hostile value. */
export const arbitraryFor = (schema: ZodType, pools: Pools): fc.Arbitrary<unknown> =>
  fc.oneof({ weight: 5, arbitrary: validFor(schema, pools, '') }, { weight: 1, arbitrary: hostile });

// A part is swapped rarely, so most values are valid but for one or two parts (those reach the handler).
const partFor = (schema: ZodType, pools: Pools, field: string) =>
  fc.oneof({ weight: 15, arbitrary: validFor(schema, pools, field) }, { weight: 1, arbitrary: hostile });

function validFor(schema: ZodType, pools: Pools, field: string): fc.Arbitrary<unknown> {
  const d = defOf(schema);
  const inner = (s: ZodType, f = field) => partFor(s, pools, f);
  switch (d.type) {
    case 'object': {
      const shape = d.shape as Record<string, ZodType>;
      const required = Object.keys(shape).filter((k) => (shape[k] as any)._zod.optin !== 'optional');
      return fc.record(Object.fromEntries(Object.entries(shape).map(([k, s]) => [k, inner(s, k)])), { requiredKeys: required });
    }
    case 'string': return text(field, d, pools);
    case 'number': return number(d);
    case 'boolean': return fc.boolean();
    case 'enum': return fc.constantFrom(...Object.values(d.entries as Record<string, unknown>));
    case 'literal': return fc.constantFrom(...(d.values as unknown[]));
    case 'array': return fc.array(inner(d.element), { maxLength: 3 });
    case 'optional': case 'default': case 'prefault': return fc.option(inner(d.innerType), { nil: undefined });
    case 'nullable': return fc.option(inner(d.innerType), { nil: null });
    case 'union': return fc.oneof(...(d.options as ZodType[]).map((o) => validFor(o, pools, field)));
    case 'pipe': return defOf(d.out).type === 'transform' ? validFor(d.in, pools, field) : validFor(d.out, pools, field);
    case 'record': return fc.dictionary(fc.string({ maxLength: 8 }), inner(d.valueType), { maxKeys: 3 });
    case 'catch': case 'readonly': case 'nonoptional': return validFor(d.innerType, pools, field);
    case 'lazy': return validFor(d.getter(), pools, field);
    default: return hostile;
  }
}
