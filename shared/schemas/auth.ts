import { z } from 'zod';
import './messages.js';
import { ROLES, PERSON_TERMS } from '../roles.js';

import { PASSWORD_MIN, PASSWORD_MAX } from '../password-rules.js';

export { PASSWORD_MIN, PASSWORD_MAX };

export const email = z.string().trim().toLowerCase().max(254, 'e-mail is too long').pipe(z.email({ message: 'enter a valid e-mail address' }));

// Length only; the server also refuses common passwords (NIST SP 800-63B rev. 4, 3.1.1.2).
export const newPassword = z
  .string()
  .min(PASSWORD_MIN, `use at least ${PASSWORD_MIN} characters`)
  .max(PASSWORD_MAX, `use at most ${PASSWORD_MAX} characters`);

export const signInBody = z.object({
  email,
  password: z.string().min(1, 'enter your password').max(1024, 'password is too long'),
});

export const setPasswordBody = z.object({
  token: z.string().min(20, 'the link is incomplete').max(200, 'the link is malformed'),
  password: newPassword,
});

export const changePasswordBody = z.object({
  currentPassword: z.string().min(1, 'enter your current password').max(1024),
  newPassword,
});

export const forgotPasswordBody = z.object({ email });

export const roleSchema = z.enum(ROLES);

export const sessionUser = z.object({
  id: z.string(),
  email: z.string(),
  name: z.string(),
  roles: z.array(roleSchema),
  site: z.object({ id: z.string(), code: z.string(), name: z.string(), timeZone: z.string(), personTerm: z.enum(PERSON_TERMS) }),
  siteIds: z.array(z.string()),
});
export type SessionUser = z.infer<typeof sessionUser>;
