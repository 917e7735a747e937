import { z } from 'zod';
import './messages.js';
import { name } from './text.js';
import { PERSON_TERMS } from '../roles.js';
import { isValidTimeZone } from '../time.js';

export const siteBody = z.object({
  code: z.string().trim().min(2, 'use 2 to 20 characters').max(20, 'use 2 to 20 characters').regex(/^[A-Z0-9-]+$/, 'use capital letters, digits and hyphens'),
  name: name().min(2, 'enter a name').max(120),
  timeZone: z.string().refine(isValidTimeZone, 'use an IANA time zone such as Europe/Berlin'),
  personTerm: z.enum(PERSON_TERMS),
});
export const siteUpdateBody = siteBody.partial().strict();
export type SiteBody = z.infer<typeof siteBody>;
