import type { Executor } from '../db/client.js';
import { notFound } from '../errors.js';
import { lockPerson, type PersonRow } from './facts.repository.js';
import { scopesWithRequirements, type ScopeWithRequirements } from './scopes.repository.js';
import { ensureAuthorisation, insertPeriod, scopesWithLaterPeriods } from './periods.repository.js';
import { loadFacts, prerequisiteOrder, type Standing } from './eligibility.js';
import { evaluateScope, type EvaluationFacts, type RequirementResult } from './requirements.js';
import { allMet, capsFor, freshSince, isFresh, plannedEnd, whatSetsTheEnd, windowStart } from './caps.js';
import { syncHolds } from './holds.js';
import { evidenceSnapshot } from './snapshot.js';
import { foldState } from './states.js';
import { newVerificationCode } from './codes.js';
import { validityEnd } from './dates.js';
import { Writer, type Change, type EvaluationContext } from './writer.js';

export type { EvaluationContext, Change };

/**
 * Re-decides every scope for one person, inside the caller's transaction (the one that changed the
 * evidence): issues what has just been completed, renews in the renewal window on fresh evidence,
 * moves ends to what periods rest on, opens and lifts automatic suspensions, and records lapses. The
 * person's row is locked first, so two completing events for one person never both issue.
 */
export async function reevaluatePerson(tx: Executor, personId: string, ctx: EvaluationContext): Promise<Change[]> {
  const now = ctx.clock.now();
  const person = await lockPerson(tx, personId);
  if (!person) throw notFound('That person');
  const scopes = await scopesWithRequirements(tx);
  const { facts, standings } = await loadFacts(tx, person, scopes, now);
  const w = new Writer(tx, ctx, now);
  // A period recorded to start later than now (a clock set back) is left as it is: nothing is decided
  // for that scope before then, so no period can be opened that would run into it.
  const ahead = await scopesWithLaterPeriods(tx, person.id, now);
  for (const scope of prerequisiteOrder(scopes)) {
    if (ahead.has(scope.id)) continue;
    const st = standings.get(scope.id);
    const issued = await decide(w, person, scope, st, facts);
    const current = issued ?? st;
    if (current) {
      standings.set(scope.id, current);
      facts.states.set(scope.id, foldState(current.period, current.events, now));
    }
  }
  return w.changes;
}

async function decide(w: Writer, person: PersonRow, scope: ScopeWithRequirements, st: Standing | undefined, facts: EvaluationFacts): Promise<Standing | undefined> {
  const results = evaluateScope(scope, facts);
  if (st && w.now < st.period.endsAt) await followBasis(w, scope, st, results);
  if (st && w.now < st.period.endsAt) {
    await syncHolds(w, scope, st, facts);
    return renewIfDue(w, person, scope, st, results);
  }
  if (st) await recordLapse(w, scope, st, results);
  return issueIfComplete(w, person, scope, st, results);
}

/** A running period ends no later than what it rests on; it comes back up to its validity when that is renewed. */
async function followBasis(w: Writer, scope: ScopeWithRequirements, st: Standing, results: RequirementResult[]) {
  const caps = capsFor(scope, st.period.origin, results);
  const end = plannedEnd(st.period.validityEndsAt, caps, st.period.startsAt);
  if (end.getTime() === st.period.endsAt.getTime()) return;
  const setter = whatSetsTheEnd(end, st.period.validityEndsAt, caps);
  await w.moveEnd(st, end, setter ? `${setter.label}: ${setter.detail}` : 'Back to the end of its validity.');
  if (end <= w.now) await recordLapse(w, scope, st, results);
}

const CLOSING = new Set(['revoked', 'ended', 'lapsed']);

async function recordLapse(w: Writer, scope: ScopeWithRequirements, st: Standing, results: RequirementResult[]) {
  if (st.events.some((e) => CLOSING.has(e.kind))) return;
  const caps = capsFor(scope, st.period.origin, results);
  const setter = whatSetsTheEnd(st.period.endsAt, st.period.validityEndsAt, caps);
  const reason = setter ? `What it rests on ran out: ${setter.label.toLowerCase()}. ${setter.detail}` : 'It reached the end of its validity.';
  await w.event(st, { kind: 'lapsed', effectiveAt: st.period.endsAt, reason });
}

async function renewIfDue(w: Writer, person: PersonRow, scope: ScopeWithRequirements, st: Standing, results: RequirementResult[]) {
  if (foldState(st.period, st.events, w.now).state !== 'active' || !allMet(results) || !scope.active || !person.active) return undefined;
  if (w.now < windowStart(st.period, scope) || !isFresh(results, freshSince(st.period, scope))) return undefined;
  const validity = validityEnd(w.now, scope.validityMonths, person.timeZone);
  const caps = capsFor(scope, 'renewed', results);
  const end = plannedEnd(validity, caps, w.now);
  if (end <= st.period.endsAt) return undefined;
  // The old period ends where the new one starts; the moved end goes to the audit trail like any other.
  await w.moveEnd(st, w.now, 'Renewed: the new period starts now.');
  return open(w, scope, st.authorisationId, person, results, { origin: 'renewed', previousPeriodId: st.period.id, validityEndsAt: validity, endsAt: end, caps });
}

async function issueIfComplete(w: Writer, person: PersonRow, scope: ScopeWithRequirements, st: Standing | undefined, results: RequirementResult[]) {
  if (!person.active || !scope.active || !allMet(results)) return undefined;
  let validity = validityEnd(w.now, scope.validityMonths, person.timeZone);
  if (st) {
    const closing = st.events.find((e) => e.kind === 'revoked' || e.kind === 'ended');
    const cutShort = st.period.endsAt < st.period.validityEndsAt && st.period.validityEndsAt > w.now;
    // After a revocation or an ending, only evidence recorded since then brings it back.
    if (closing && !isFresh(results, closing.effectiveAt)) return undefined;
    // Cut short by what it rested on: it resumes, up to its original validity, once that is back.
    if (!closing && cutShort) validity = st.period.validityEndsAt;
    // Ran its full validity: it needs evidence recorded since its renewal window opened.
    else if (!closing && !isFresh(results, freshSince(st.period, scope))) return undefined;
  }
  const caps = capsFor(scope, 'issued', results);
  const end = plannedEnd(validity, caps, w.now);
  if (end <= w.now) return undefined;
  const auth = st ? { id: st.authorisationId } : await ensureAuthorisation(w.tx, person.id, scope.id, w.now);
  return open(w, scope, auth.id, person, results, { origin: 'issued', previousPeriodId: null, validityEndsAt: validity, endsAt: end, caps });
}

interface Opening {
  origin: 'issued' | 'renewed';
  previousPeriodId: string | null;
  validityEndsAt: Date;
  endsAt: Date;
  caps: RequirementResult[];
}

async function open(w: Writer, scope: ScopeWithRequirements, authorisationId: string, person: PersonRow, results: RequirementResult[], o: Opening): Promise<Standing> {
  const setter = whatSetsTheEnd(o.endsAt, o.validityEndsAt, o.caps);
  const period = await insertPeriod(w.tx, {
    authorisationId, holderId: person.id, scopeId: scope.id, startsAt: w.now, endsAt: o.endsAt, validityEndsAt: o.validityEndsAt,
    origin: o.origin, previousPeriodId: o.previousPeriodId, verificationCode: newVerificationCode(),
    evidenceSnapshot: evidenceSnapshot(scope, results, w.now, w.actorId, setter), issuedBy: w.actorId, recordedAt: w.now,
  });
  const st: Standing = { authorisationId, period, events: [] };
  await w.event(st, { kind: o.origin, effectiveAt: w.now, details: { previousPeriodId: o.previousPeriodId, endsAt: o.endsAt.toISOString() } });
  return st;
}
