import { subjectOf, type AppAbility } from '../../shared/abilities.js';
import type { Executor } from '../db/client.js';
import { conflict, forbidden, notFound } from '../errors.js';
import { findSignoff, type SignoffRow } from './signoffs.repository.js';

export async function readableSignoff(db: Executor, ability: AppAbility, id: string) {
  const row = await findSignoff(db, id);
  if (!row) throw notFound('That sign-off');
  if (!ability.can('read', subjectOf('Signoff', row))) throw forbidden('You may not see this sign-off.');
  return row;
}

/** Signed means settled: any change to it is refused, pointing to a correction. */
export function refuseUnlessOpen(row: SignoffRow) {
  if (row.status === 'in_progress') return;
  throw conflict(`This sign-off is ${row.status === 'returned' ? 'returned' : 'signed'} and never changes; open a correction of it instead.`, { status: row.status });
}

export async function editableSignoff(db: Executor, ability: AppAbility, id: string, lock = false) {
  const row = await findSignoff(db, id, lock);
  if (!row) throw notFound('That sign-off');
  if (!ability.can('update', subjectOf('Signoff', row))) {
    throw forbidden(ability.can('read', subjectOf('Signoff', row)) ? 'Only the person it is about fills in a sign-off.' : 'You may not see this sign-off.');
  }
  refuseUnlessOpen(row);
  return row;
}
