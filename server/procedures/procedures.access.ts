import { subjectOf, type AppAbility } from '../../shared/abilities.js';
import type { Executor } from '../db/client.js';
import { notFound } from '../errors.js';
import * as repo from './procedures.repository.js';

/** A version the reader may open; one they may not see is reported as not found, so drafts stay private. */
export async function readableVersion(db: Executor, ability: AppAbility, procedureId: string, versionId: string) {
  const version = await repo.findVersion(db, procedureId, versionId);
  if (!version || !ability.can('read', subjectOf('Procedure', version))) throw notFound('That procedure version');
  return version;
}

export async function existingVersion(db: Executor, procedureId: string, versionId: string) {
  const version = await repo.findVersion(db, procedureId, versionId);
  if (!version) throw notFound('That procedure version');
  return version;
}

export async function existingProcedure(db: Executor, id: string, lock = false) {
  const procedure = await repo.findProcedure(db, id, lock);
  if (!procedure) throw notFound('That procedure');
  return procedure;
}
