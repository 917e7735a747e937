import { z } from 'zod';
import './messages.js';

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
  return z.string().trim().min(1, emptyMessage).max(100).overwrite((v) => (UUID_SHAPE.test(v) ? v.toLowerCase() : v));
}

export const pageQuery = z.object({
  page: z.coerce.number().int().min(1).max(100_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(25),
  q: z.string().trim().max(200).optional(),
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

// An empty field says so rather than asking for a format (the first message per field is the one shown).
export const isoDate = z.string().min(1, 'enter a date').regex(/^\d{4}-\d{2}-\d{2}$/, 'use the form YYYY-MM-DD');
