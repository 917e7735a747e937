import { z } from 'zod';
import type { Executor } from '../db/client.js';
import { findPractical } from './practicals.repository.js';

/** Evidence of a practical belongs to its technician, and is attached only while it is being recorded. */
export async function practicalEvidenceLink(db: Executor, link: { entityId: string; ownerId: string }): Promise<string | null> {
  const p = z.uuid().safeParse(link.entityId).success ? await findPractical(db, link.entityId) : undefined;
  if (!p) return 'no such practical';
  if (p.technicianId !== link.ownerId) return "a practical's evidence belongs to the technician assessed (ownerId)";
  return p.status === 'in_progress' ? null : 'that practical is signed and no longer changes';
}
