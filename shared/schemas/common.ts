import { z } from 'zod';
import './messages.js';
import { line } from './text.js';

/**
 * Every id that enters through a schema: a hyphenated UUID in any letter case, lower-cased here once, so
 * rules compare one spelling. Braces, missing hyphens or a urn: prefix (which PostgreSQL would take) are
 * refused with 400. The case is folded before the check, so upper-case nil and max UUIDs pass like the rest.
 * `message` (when given) speaks for every problem with the field, as a schema's own message does elsewhere.
 */
export function uuid(message?: string) {
  return z.string(message ? { error: message } : undefined).toLowerCase().pipe(z.uuid({ error: message ?? 'must be a UUID' }));
}

export const uuidParam = z.object({ id: uuid('id must be a UUID') });

const UUID_SHAPE = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** A record id given as text (not every record kind is keyed by a UUID); one that is a UUID is lower-cased like `uuid()`. */
export function recordId(emptyMessage?: string) {
  return line().min(1, emptyMessage).max(100).overwrite((v) => (UUID_SHAPE.test(v) ? v.toLowerCase() : v));
}

export const pageQuery = z.object({
  page: z.coerce.number().int().min(1).max(100_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(25),
  q: line().max(200).optional(),
});

export interface Page<T> {
  items: T[];
  total: number;
  page: number;
  pageSize: number;
}

/** The one error body every API error uses. */
export interface ApiErrorBody {
  error: { code: string; message: string; fields?: Record<string, string> };
}

const DATE_SHAPE = /^\d{4}-\d{2}-\d{2}$/;
/** Dates outside this span are typing slips (PostgreSQL would refuse 2026-02-30 and take 0000-01-01 as 1 BC). */
export const DATE_RANGE_MESSAGE = 'must be a real date between 1900 and 2199';
/** A YYYY-MM-DD that names a day of the calendar between 1900-01-01 and 2199-12-31. */
export function isRealDate(v: string): boolean {
  if (!DATE_SHAPE.test(v) || v < '1900-01-01' || v > '2199-12-31') return false;
  const d = new Date(`${v}T00:00:00Z`);
  return !Number.isNaN(d.getTime()) && d.toISOString().slice(0, 10) === v;
}

// An empty field says so rather than asking for a format (the first message per field is the one shown).
export const isoDate = z.string().min(1, 'enter a date').regex(DATE_SHAPE, 'use the form YYYY-MM-DD')
  .refine((v) => !DATE_SHAPE.test(v) || isRealDate(v), DATE_RANGE_MESSAGE);

/** A moment with its offset, e.g. 2026-03-05T14:30:00Z or 2026-03-05T15:30:00+01:00, on a real date in the span above. */
export const isoMoment = z.iso.datetime({ offset: true, message: 'use a date and time with its offset, such as 2026-03-05T14:30:00Z' })
  .refine((v) => isRealDate(v.slice(0, 10)), DATE_RANGE_MESSAGE);
