import type { RegisterView } from '../../shared/register/kinds.js';
import type { MomentInfo } from '../../shared/register/views.js';
import { unprocessable } from '../errors.js';
import type { Moment } from './state.sql.js';

/** The moment a request asks about: now when none is given; never the future, which nobody can vouch for. */
export function resolveMoment(q: { at?: string; view: RegisterView }, now: Date): Moment & { info: MomentInfo } {
  const at = q.at ? new Date(q.at) : now;
  if (at > now) throw unprocessable('at: the register cannot show a moment that has not happened yet', { at: 'must not be in the future' });
  const known = q.view === 'known' && !!q.at;
  return { at, known, info: { at: at.toISOString(), view: q.at ? q.view : 'effective', isNow: !q.at } };
}
