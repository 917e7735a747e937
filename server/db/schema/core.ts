import { sql } from 'drizzle-orm';
import {
  pgTable, uuid, text, boolean, integer, timestamp, date, primaryKey, index, uniqueIndex, check, bigint, jsonb, customType,
} from 'drizzle-orm/pg-core';

// A PostgreSQL transaction id (64-bit), read as text.
const xid8 = customType<{ data: string }>({ dataType: () => 'xid8' });

const ts = (name: string) => timestamp(name, { withTimezone: true, mode: 'date' });

export const sites = pgTable('sites', {
  id: uuid('id').primaryKey().defaultRandom(),
  code: text('code').notNull(),
  name: text('name').notNull(),
  timeZone: text('time_zone').notNull(),
  // The trade term for a person fit for live work differs by jurisdiction: EN 50110 "skilled person", NFPA 70E "qualified person".
  personTerm: text('person_term').notNull(),
  createdAt: ts('created_at').notNull(),
}, (t) => [
  uniqueIndex('sites_code_uq').on(t.code),
  check('sites_person_term_ck', sql`${t.personTerm} in ('skilled person', 'qualified person')`),
]);

export const users = pgTable('users', {
  id: uuid('id').primaryKey().defaultRandom(),
  email: text('email').notNull(),
  name: text('name').notNull(),
  siteId: uuid('site_id').notNull().references(() => sites.id),
  passwordHash: text('password_hash'),
  active: boolean('active').notNull(),
  failedSignIns: integer('failed_sign_ins').notNull().default(0),
  lockedUntil: ts('locked_until'),
  accessEndsOn: date('access_ends_on', { mode: 'string' }),
  deactivatedReason: text('deactivated_reason'),
  createdAt: ts('created_at').notNull(),
  updatedAt: ts('updated_at').notNull(),
}, (t) => [
  uniqueIndex('users_email_uq').on(t.email),
  index('users_site_name_idx').on(t.siteId, t.name),
  index('users_name_idx').on(t.name),
  check('users_email_lower_ck', sql`${t.email} = lower(${t.email})`),
]);

export const userRoles = pgTable('user_roles', {
  userId: uuid('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  role: text('role').notNull(),
}, (t) => [
  primaryKey({ columns: [t.userId, t.role] }),
  check('user_roles_role_ck', sql`${t.role} in ('technician', 'assessor', 'manager', 'auditor', 'admin')`),
]);

// Sites an assessor or manager covers besides their own.
export const userSites = pgTable('user_sites', {
  userId: uuid('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  siteId: uuid('site_id').notNull().references(() => sites.id),
}, (t) => [primaryKey({ columns: [t.userId, t.siteId] }), index('user_sites_site_idx').on(t.siteId)]);

export const accountTokens = pgTable('account_tokens', {
  id: uuid('id').primaryKey().defaultRandom(),
  userId: uuid('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  purpose: text('purpose').notNull(),
  tokenHash: text('token_hash').notNull(),
  expiresAt: ts('expires_at').notNull(),
  usedAt: ts('used_at'),
  createdAt: ts('created_at').notNull(),
}, (t) => [
  uniqueIndex('account_tokens_hash_uq').on(t.tokenHash),
  index('account_tokens_user_idx').on(t.userId),
  check('account_tokens_purpose_ck', sql`${t.purpose} in ('invite', 'reset')`),
]);

// The outbox: every e-mail is a row written in the transaction that causes it, then delivered by the queue.
// `dedupe_key` makes a message once per cause; `message_id` stays the same across attempts.
export const mailLog = pgTable('mail_log', {
  id: uuid('id').primaryKey().defaultRandom(),
  dedupeKey: text('dedupe_key').notNull(),
  toAddress: text('to_address').notNull(),
  subject: text('subject').notNull(),
  // Null only for messages recorded before the outbox kept their text.
  body: text('body'),
  kind: text('kind').notNull(),
  status: text('status').notNull(),
  attempts: integer('attempts').notNull().default(0),
  nextAttemptAt: ts('next_attempt_at').notNull(),
  claimedAt: ts('claimed_at'),
  fileName: text('file_name'),
  messageId: text('message_id'),
  error: text('error'),
  createdAt: ts('created_at').notNull(),
  sentAt: ts('sent_at'),
}, (t) => [
  index('mail_log_created_idx').on(t.createdAt),
  uniqueIndex('mail_log_dedupe_uq').on(t.dedupeKey),
  index('mail_log_due_idx').on(t.nextAttemptAt).where(sql`${t.status} in ('waiting', 'sending')`),
  check('mail_log_status_ck', sql`${t.status} in ('waiting', 'sending', 'sent', 'failed', 'cancelled')`),
]);

// Append-only. The application role may only INSERT and SELECT here (see the roles migration). A trigger
// stamps `tx` (the writer's transaction) and then `id` (from audit_log_id_seq); the seals are in audit_seal.
export const auditLog = pgTable('audit_log', {
  id: bigint('id', { mode: 'number' }).primaryKey(),
  tx: xid8('tx'),
  at: ts('at').notNull(),
  actorId: uuid('actor_id'),
  action: text('action').notNull(),
  entity: text('entity').notNull(),
  entityId: text('entity_id').notNull(),
  oldValues: jsonb('old_values'),
  newValues: jsonb('new_values'),
}, (t) => [
  index('audit_log_entity_idx').on(t.entity, t.entityId),
  index('audit_log_actor_idx').on(t.actorId, t.at),
  index('audit_log_at_idx').on(t.at),
]);
