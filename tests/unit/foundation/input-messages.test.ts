import { describe, it, expect } from 'vitest';
import { z } from 'zod';
import { isoDate } from '../../../shared/schemas/common.js';
import '../../../shared/schemas/messages.js';

const first = (schema: z.ZodType, value: unknown) => {
  const r = schema.safeParse(value);
  return r.success ? null : r.error.issues[0].message;
};

describe('input errors in plain words', () => {
  it('when a date is left empty, then it says to enter one; when it is in another form, then it names the form', () => {
    expect(first(isoDate, '')).toBe('enter a date');
    expect(first(isoDate, '1.3.2026')).toBe('use the form YYYY-MM-DD');
    expect(first(isoDate, '2026-03-01')).toBeNull();
  });

  it('when a rule without its own message is broken, then the shared wording speaks for it', () => {
    expect(first(z.object({ a: z.number() }), {})).toBe('is required');
    expect(first(z.number().int(), 2.5)).toBe('must be a whole number');
    expect(first(z.number().positive(), 0)).toBe('must be more than 0');
    expect(first(z.number().max(180), 200)).toBe('must be at most 180');
    expect(first(z.string().min(1), '')).toBe('must not be empty');
    expect(first(z.string().max(3), 'abcd')).toBe('must have at most 3 characters');
    expect(first(z.enum(['A', 'F', 'B']), 'AC')).toBe('must be one of: A, F, B');
  });
});
