import type { Executor } from '../db/client.js';
import type { AuthorisationState } from '../../shared/authorisations/kinds.js';
import { authorisationFor, eventsOf, findAuthorisation, latestPeriods, type EventRow, type PeriodRow } from './periods.repository.js';

export interface Hold {
  cause: string;
  since: Date;
  reason: string | null;
  renewalSubmitted: boolean;
}

export interface DerivedState {
  state: AuthorisationState;
  /** When the state began (the event or the period end that made it). */
  since: Date | null;
  reason: string | null;
  /** Open suspensions, each with what it hangs on: 'manual', 'prerequisite:<scope id>' or 'certificate:<kind>'. */
  holds: Hold[];
  /** The period in force at that moment, or the last one before it. */
  period: PeriodRow | null;
}

export const NOT_HELD: DerivedState = { state: 'none', since: null, reason: null, holds: [], period: null };

/**
 * The state of one period at `at`, from its events that had taken effect by then. A period past its end
 * is what its last closing event says (revoked, ended, lapsed), or lapsed by itself when none is recorded yet.
 */
export function foldState(period: PeriodRow | null, events: EventRow[], at: Date): DerivedState {
  if (!period || period.startsAt > at) return NOT_HELD;
  const holds = new Map<string, Hold>();
  let closing: EventRow | null = null;
  let since: Date = period.startsAt;
  for (const e of events) {
    if (e.periodId !== period.id || e.effectiveAt > at) continue;
    if (e.kind === 'suspended') holds.set(e.cause!, { cause: e.cause!, since: e.effectiveAt, reason: e.reason, renewalSubmitted: false });
    else if (e.kind === 'reinstated' || e.kind === 'restored') {
      holds.delete(e.cause!);
      since = e.effectiveAt;
    } else if (e.kind === 'renewal_submitted') {
      const h = holds.get(e.cause!);
      if (h) h.renewalSubmitted = true;
    } else if (e.kind === 'revoked' || e.kind === 'ended' || e.kind === 'lapsed') closing ??= e;
    else since = e.effectiveAt;
  }
  const list = [...holds.values()];
  if (closing && closing.effectiveAt <= at) return { state: closing.kind as AuthorisationState, since: closing.effectiveAt, reason: closing.reason, holds: [], period };
  if (at >= period.endsAt) return { state: 'lapsed', since: period.endsAt, reason: 'It reached its expiry.', holds: [], period };
  if (list.length) {
    const waiting = list.every((h) => h.cause.startsWith('certificate:') && h.renewalSubmitted);
    const latest = list.reduce((a, b) => (b.since > a.since ? b : a));
    return { state: waiting ? 'renewal_submitted' : 'suspended', since: latest.since, reason: list.map((h) => h.reason).filter(Boolean).join(' ') || null, holds: list, period };
  }
  return { state: 'active', since, reason: null, holds: [], period };
}

export type StateTarget = { authorisationId: string } | { personId: string; scopeId: string };

/** The state of one person's authorisation for one scope at any moment; the current state is stateAt(…, now). */
export async function stateAt(db: Executor, target: StateTarget, at: Date): Promise<DerivedState & { authorisationId: string | null }> {
  const auth = 'authorisationId' in target ? await findAuthorisation(db, target.authorisationId) : await authorisationFor(db, target.personId, target.scopeId);
  if (!auth) return { ...NOT_HELD, authorisationId: null };
  const states = await statesAt(db, { authorisationIds: [auth.id] }, at);
  return { ...(states.get(auth.id) ?? NOT_HELD), authorisationId: auth.id };
}

/** Many authorisations at one moment in two queries (periods, then their events): for lists and registers. */
export async function statesAt(db: Executor, filter: Parameters<typeof latestPeriods>[1], at: Date): Promise<Map<string, DerivedState>> {
  const periods = await latestPeriods(db, filter, at);
  const events = await eventsOf(db, periods.map((p) => p.id), at);
  const byPeriod = new Map<string, EventRow[]>();
  for (const e of events) byPeriod.set(e.periodId, [...(byPeriod.get(e.periodId) ?? []), e]);
  return new Map(periods.map((p) => [p.authorisationId, foldState(p, byPeriod.get(p.id) ?? [], at)]));
}

export const isCurrent = (s: DerivedState) => s.state === 'active';
export const isSuspended = (s: DerivedState) => s.state === 'suspended' || s.state === 'renewal_submitted';
