import { z } from 'zod';
import type { Executor } from '../db/client.js';
import type { EvidenceEntity } from '../../shared/schemas/evidence.js';
import { findCheck } from '../benches/benches.repository.js';
import { signoffEvidenceLink } from '../signoffs/evidence-link.js';
import { practicalEvidenceLink } from '../practicals/evidence-link.js';

/** What the upload is attached to, checked against the owner; null when it fits, else the problem. */
export type LinkCheck = (db: Executor, link: { entityId: string; ownerId: string }) => Promise<string | null>;

const isUuid = (v: string) => z.uuid().safeParse(v).success;

/** One line per record kind evidence can belong to; sign-offs, practicals and certificates add theirs. */
export const EVIDENCE_LINKS: Record<EvidenceEntity, LinkCheck> = {
  person: async (_db, { entityId, ownerId }) => (entityId === ownerId ? null : "for a person's own record, entityId is the owner's id"),
  bench_check: async (db, { entityId, ownerId }) => {
    const found = isUuid(entityId) ? await findCheck(db, entityId) : undefined;
    if (!found) return 'no such pre-use check';
    return found.check.personId === ownerId ? null : 'that pre-use check was recorded by someone else';
  },
  signoff: signoffEvidenceLink,
  practical: practicalEvidenceLink,
};
