import { z } from 'zod';
import type { Executor } from '../db/client.js';
import { findSignoff } from './signoffs.repository.js';

/** Evidence of a sign-off belongs to the person it is about, and is attached only before it is signed. */
export async function signoffEvidenceLink(db: Executor, link: { entityId: string; ownerId: string }): Promise<string | null> {
  const s = z.uuid().safeParse(link.entityId).success ? await findSignoff(db, link.entityId) : undefined;
  if (!s) return 'no such sign-off';
  if (s.personId !== link.ownerId) return 'that sign-off is someone else’s';
  return s.status === 'in_progress' ? null : 'that sign-off is signed and no longer changes';
}
