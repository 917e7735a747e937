import { z } from 'zod';
import './messages.js';
import { line } from './text.js';
import { isoDate } from './common.js';

/**
 * A manager's check of an external certificate: against the scan on file, or against the original seen
 * in person (where, and on which day). Without a scan, only the second is accepted.
 */
export const certificateCheckBody = z.object({
  password: z.string().min(1, 're-enter your password to sign').max(1024, 'password is too long'),
  sawOriginal: z.boolean({ message: 'say yes or no' }).default(false),
  sawOriginalWhere: line().max(200, 'use at most 200 characters').optional().transform((v) => v?.trim() || null),
  sawOriginalOn: isoDate.optional(),
}).strict();
export type CertificateCheckBody = z.infer<typeof certificateCheckBody>;

export const CHECKED_HOW_LABELS = {
  scan: 'checked against the scan on file',
  original_seen: 'checked against the original, seen in person',
} as const;
export type CheckedHow = keyof typeof CHECKED_HOW_LABELS;
