import type { Executor } from '../db/client.js';
import { conflict, notFound, unprocessable } from '../errors.js';
import { loadChecklists, loadSteps, type StoredChecklist, type StoredItem } from '../procedures/content.repository.js';
import { findProcedure, findVersion } from '../procedures/procedures.repository.js';

export type RecordChecklist = Omit<StoredChecklist, 'id' | 'items'> & { id: string; items: (StoredItem & { id: string })[] };

/**
 * The checklist a new record is filled against: of the version in force only, and of the expected kind.
 * With no checklistId, the version's first checklist of that kind.
 */
export async function checklistInForce(db: Executor, procedureId: string, versionId: string, checklistId: string | undefined, kinds: readonly string[]) {
  const [procedure, version] = await Promise.all([findProcedure(db, procedureId), findVersion(db, procedureId, versionId)]);
  if (!procedure || !version) throw notFound('That procedure version');
  if (version.status !== 'published') {
    throw conflict(`versionId: version ${version.number} of ${procedure.code} is ${version.status.replace('_', ' ')}, not in force; use the version in force`, { versionId: 'not the version in force' });
  }
  const lists = (await loadChecklists(db, versionId)) as RecordChecklist[];
  const checklist = checklistId ? lists.find((c) => c.id === checklistId) : lists.find((c) => kinds.includes(c.kind));
  if (!checklist) throw unprocessable('checklistId: this version has no such checklist', { checklistId: 'no such checklist in this version' });
  if (!kinds.includes(checklist.kind)) throw unprocessable(`checklistId: "${checklist.title}" is not a checklist of this kind`, { checklistId: `choose a ${kinds.join(' or ')} checklist` });
  return { procedure, version, checklist };
}

/** The checklist a record was opened against (it never changes: the version is published or later). */
export async function checklistOf(db: Executor, versionId: string, checklistId: string) {
  const list = ((await loadChecklists(db, versionId)) as RecordChecklist[]).find((c) => c.id === checklistId);
  if (!list) throw notFound('That checklist');
  return list;
}

export async function holdPointsOf(db: Executor, versionId: string) {
  const steps = await loadSteps(db, versionId);
  return steps.map((s, position) => ({ ...s, position })).filter((s) => s.holdPoint);
}
