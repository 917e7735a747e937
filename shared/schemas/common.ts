import { z } from 'zod';
import './messages.js';

export const uuidParam = z.object({ id: z.uuid({ message: 'id must be a UUID' }) });

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
