import type { Executor } from '../db/client.js';
import { STATE_LABELS } from '../../shared/authorisations/kinds.js';
import { forbidden, unprocessable } from '../errors.js';
import { stateAt } from '../authorisations/index.js';
import { scopeBrief } from './practicals.repository.js';

/**
 * An assessor holds at least the scope being assessed, in force at that moment. Until the practical
 * names a scope, the assessor role (checked by the abilities) is what counts.
 */
export async function checkAssessorStanding(db: Executor, assessorId: string, scopeId: string | null, at: Date) {
  if (!scopeId) return null;
  const scope = await scopeBrief(db, scopeId);
  if (!scope) throw unprocessable('scopeId: no such authorisation scope', { scopeId: 'no such scope' });
  const standing = await stateAt(db, { personId: assessorId, scopeId }, at);
  if (standing.state !== 'active') {
    throw forbidden(`You do not hold ${scope.code} in force today (${STATE_LABELS[standing.state].toLowerCase()}); an assessor holds at least the scope being assessed.`);
  }
  return scope;
}
