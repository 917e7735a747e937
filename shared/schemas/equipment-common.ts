import { z } from 'zod';
import './messages.js';
import { isoDate } from './common.js';
import { paragraph } from './text.js';

/** A real calendar date in the common span (the shared isoDate checks both). */
export const calendarDate = isoDate;
export const equipmentCode = z
  .string()
  .trim()
  .min(2, 'use 2 to 20 characters')
  .max(20, 'use 2 to 20 characters')
  .regex(/^[A-Z0-9-]+$/, 'use capital letters, digits and hyphens');

export const notes = paragraph().max(1000, 'use at most 1000 characters');

/** How a bench or an instrument stands today: a refusal blocks its use for a practical, a warning is shown. */
export const equipmentFlag = z.object({
  code: z.string(),
  severity: z.enum(['refuse', 'warn']),
  field: z.string(),
  message: z.string(),
});
export type EquipmentFlag = z.infer<typeof equipmentFlag>;

export const activeFilter = z.enum(['true', 'false']).optional();
