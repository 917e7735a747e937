import { z } from 'zod';
import './messages.js';
import { line } from './text.js';
import { pageQuery, recordId, uuid } from './common.js';

export const EVIDENCE_MEDIA_TYPES = ['image/jpeg', 'image/png', 'application/pdf', 'text/csv'] as const;
export type EvidenceMediaType = (typeof EVIDENCE_MEDIA_TYPES)[number];

/** Records evidence can belong to; a later feature adds its record kind here and a link check on the server. */
export const EVIDENCE_ENTITIES = ['person', 'bench_check', 'signoff', 'practical'] as const;
export type EvidenceEntity = (typeof EVIDENCE_ENTITIES)[number];

/** The extensions a name may carry for each detected type (the bytes decide the type; the name must not contradict it). */
export const EVIDENCE_EXTENSIONS: Record<EvidenceMediaType, readonly string[]> = {
  'image/jpeg': ['jpg', 'jpeg', 'jfif'],
  'image/png': ['png'],
  'application/pdf': ['pdf'],
  'text/csv': ['csv', 'txt'],
};

/** The text fields sent with the file in the multipart form. */
export const evidenceUploadFields = z
  .object({
    ownerId: uuid('ownerId must be a person id').optional(),
    entity: z.enum(EVIDENCE_ENTITIES, { message: `use one of: ${EVIDENCE_ENTITIES.join(', ')}` }).default('person'),
    entityId: recordId('give the record id').optional(),
    caption: line().max(500, 'use at most 500 characters').optional(),
  })
  .strict();

export const evidenceQuery = pageQuery.omit({ q: true }).extend({
  ownerId: uuid('ownerId must be a person id').optional(),
  entity: z.enum(EVIDENCE_ENTITIES).optional(),
  entityId: recordId().optional(),
});

export const evidenceRow = z.object({
  id: z.string(),
  ownerId: z.string(),
  ownerName: z.string(),
  siteId: z.string(),
  uploaderId: z.string(),
  uploaderName: z.string(),
  entity: z.enum(EVIDENCE_ENTITIES),
  entityId: z.string(),
  fileName: z.string(),
  mediaType: z.enum(EVIDENCE_MEDIA_TYPES),
  sizeBytes: z.number(),
  sha256: z.string(),
  caption: z.string().nullable(),
  uploadedAt: z.string(),
  contentUrl: z.string(),
});

export type EvidenceUploadFields = z.infer<typeof evidenceUploadFields>;
export type EvidenceQuery = z.infer<typeof evidenceQuery>;
export type EvidenceRow = z.infer<typeof evidenceRow>;
