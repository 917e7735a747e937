import { sql } from 'drizzle-orm';
import { pgTable, uuid, text, integer, timestamp, index, check, customType } from 'drizzle-orm/pg-core';
import { sites, users } from './core.js';

// node-postgres reads bytea as a Buffer and writes a Buffer as bytea.
const bytea = customType<{ data: Buffer; driverData: Buffer }>({ dataType: () => 'bytea' });

/**
 * An uploaded file kept with the record it belongs to: the owner's (a person), and the record within it
 * (entity, entityId). The type was detected from the bytes; the hash is of the stored content.
 */
export const evidence = pgTable('evidence', {
  id: uuid('id').primaryKey().defaultRandom(),
  ownerId: uuid('owner_id').notNull().references(() => users.id),
  // The owner's site when uploaded: who covers that site may see it.
  siteId: uuid('site_id').notNull().references(() => sites.id),
  uploaderId: uuid('uploader_id').notNull().references(() => users.id),
  entity: text('entity').notNull(),
  entityId: text('entity_id').notNull(),
  fileName: text('file_name').notNull(),
  mediaType: text('media_type').notNull(),
  sizeBytes: integer('size_bytes').notNull(),
  sha256: text('sha256').notNull(),
  caption: text('caption'),
  content: bytea('content').notNull(),
  uploadedAt: timestamp('uploaded_at', { withTimezone: true, mode: 'date' }).notNull(),
}, (t) => [
  index('evidence_owner_idx').on(t.ownerId, t.uploadedAt),
  index('evidence_entity_idx').on(t.entity, t.entityId),
  index('evidence_site_idx').on(t.siteId, t.uploadedAt),
  check('evidence_media_type_ck', sql`${t.mediaType} in ('image/jpeg', 'image/png', 'application/pdf', 'text/csv')`),
  check('evidence_sha256_ck', sql`${t.sha256} ~ '^[0-9a-f]{64}$'`),
  check('evidence_size_ck', sql`${t.sizeBytes} > 0 and ${t.sizeBytes} = octet_length(${t.content})`),
]);
