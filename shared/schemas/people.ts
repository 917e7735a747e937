import { z } from 'zod';
import './messages.js';
import { name as personName, paragraph } from './text.js';
import { email, roleSchema } from './auth.js';
import { isoDate, pageQuery, uuid } from './common.js';

const name = personName().min(1, 'enter a name').max(120, 'use at most 120 characters');

export const inviteBody = z.object({
  email,
  name,
  siteId: uuid('choose a site'),
  roles: z.array(roleSchema).min(1, 'give at least one role').max(5),
  coveredSiteIds: z.array(uuid()).max(100).default([]),
  accessEndsOn: isoDate.optional(),
});

export const updatePersonBody = z
  .object({
    name: name.optional(),
    siteId: uuid('choose a site').optional(),
    roles: z.array(roleSchema).min(1, 'give at least one role').max(5).optional(),
    coveredSiteIds: z.array(uuid()).max(100).optional(),
    active: z.boolean().optional(),
    deactivatedReason: paragraph().min(3, 'give a reason').max(500).optional(),
    accessEndsOn: isoDate.nullable().optional(),
  })
  .strict();

export const peopleQuery = pageQuery.extend({
  siteId: uuid().optional(),
  role: roleSchema.optional(),
  active: z.enum(['true', 'false']).optional(),
  sort: z.enum(['name', 'email', 'site', 'createdAt']).default('name'),
  dir: z.enum(['asc', 'desc']).default('asc'),
});

export const personRow = z.object({
  id: z.string(),
  email: z.string(),
  name: z.string(),
  siteId: z.string(),
  siteName: z.string(),
  roles: z.array(roleSchema),
  coveredSiteIds: z.array(z.string()),
  active: z.boolean(),
  accessEndsOn: z.string().nullable(),
  hasPassword: z.boolean(),
  createdAt: z.string(),
});
export type PersonRow = z.infer<typeof personRow>;
export type InviteBody = z.infer<typeof inviteBody>;
export type UpdatePersonBody = z.infer<typeof updatePersonBody>;

/** GET /api/people/:id: a row without the site name, plus the deactivation reason. */
export const personDetail = personRow.omit({ siteName: true }).extend({ deactivatedReason: z.string().nullable() });
export type PersonDetail = z.infer<typeof personDetail>;
export type PeopleQuery = z.infer<typeof peopleQuery>;
