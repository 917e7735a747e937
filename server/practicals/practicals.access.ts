import { subjectOf, type AppAbility } from '../../shared/abilities.js';
import type { Executor } from '../db/client.js';
import { conflict, forbidden, notFound } from '../errors.js';
import { findPractical, type PracticalRow } from './practicals.repository.js';

export async function readablePractical(db: Executor, ability: AppAbility, id: string) {
  const row = await findPractical(db, id);
  if (!row) throw notFound('That practical');
  if (!ability.can('read', subjectOf('Practical', row))) throw forbidden('You may not see this practical.');
  return row;
}

export function refuseUnlessOpen(row: PracticalRow) {
  if (row.status === 'in_progress') return;
  throw conflict('This practical is signed and never changes; open a correction of it instead.', { status: row.status });
}

/** Only its own assessor records a practical, and only until they sign it. */
export async function recordablePractical(db: Executor, ability: AppAbility, id: string, lock = false) {
  const row = await findPractical(db, id, lock);
  if (!row) throw notFound('That practical');
  if (!ability.can('update', subjectOf('Practical', row))) {
    throw forbidden(ability.can('read', subjectOf('Practical', row)) ? 'Only the assessor of this practical records it.' : 'You may not see this practical.');
  }
  refuseUnlessOpen(row);
  return row;
}
