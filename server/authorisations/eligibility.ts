import type { Executor } from '../db/client.js';
import { certificatesOf } from './certificates.repository.js';
import { ackFacts, type PersonRow } from './facts.repository.js';
import { competentPracticals, countersignedSignoffs, inForceThresholds } from './records-facts.repository.js';
import { eventsOf, latestPeriods, type EventRow, type PeriodRow } from './periods.repository.js';
import { evaluateScope, type EvaluationFacts, type RequirementResult } from './requirements.js';
import type { ScopeWithRequirements } from './scopes.repository.js';
import { foldState, type DerivedState } from './states.js';

/** A person's latest period of one scope with all its events: what the decisions work on. */
export interface Standing {
  authorisationId: string;
  period: PeriodRow;
  events: EventRow[];
}

/** Everything the evaluators need for one person, in a handful of queries. */
export async function loadFacts(db: Executor, person: PersonRow, scopes: ScopeWithRequirements[], now: Date) {
  return (await loadFactsOfMany(db, [person], scopes, now)).get(person.id)!;
}

/** The same for several people at once, in the same handful of queries (a reminder batch, say). */
export async function loadFactsOfMany(db: Executor, people: PersonRow[], scopes: ScopeWithRequirements[], now: Date) {
  const ofKind = (kind: string) => [...new Set(scopes.flatMap((s) => s.requirements.filter((r) => r.kind === kind).map((r) => r.procedureId!)))];
  const [practicalIds, signoffIds] = [ofKind('practicals'), ofKind('checklist_signoff')];
  const procedureIds = [...new Set([...ofKind('procedure_ack'), ...practicalIds, ...signoffIds])];
  const ids = people.map((p) => p.id);
  // One after another: inside a transaction they share one connection, which takes one query at a time.
  const certificates = await certificatesOf(db, ids);
  const acks = await ackFacts(db, ids, procedureIds);
  const periods = await latestPeriods(db, { holderIds: ids }, now);
  const practicals = await competentPracticals(db, ids, practicalIds);
  const signoffs = await countersignedSignoffs(db, ids, signoffIds);
  const thresholds = await inForceThresholds(db, [...practicalIds, ...signoffIds]);
  const events = await eventsOf(db, periods.map((p) => p.id));
  const scopeMap = new Map(scopes.map((s) => [s.id, s]));
  const out = new Map<string, { facts: EvaluationFacts; standings: Map<string, Standing> }>();
  for (const person of people) {
    const standings = new Map<string, Standing>();
    for (const p of periods) {
      if (p.holderId === person.id) standings.set(p.scopeId, { authorisationId: p.authorisationId, period: p, events: events.filter((e) => e.periodId === p.id) });
    }
    const states = new Map<string, DerivedState>();
    for (const [scopeId, s] of standings) states.set(scopeId, foldState(s.period, s.events, now));
    const facts: EvaluationFacts = {
      person, now, certificates: certificates.filter((c) => c.holderId === person.id), acks: acks.get(person.id)!,
      practicals: practicals.filter((r) => r.personId === person.id), signoffs: signoffs.filter((r) => r.personId === person.id),
      thresholds, scopes: scopeMap, states,
    };
    out.set(person.id, { facts, standings });
  }
  return out;
}

/** Scopes with the ones they rest on first, so a prerequisite is decided before what depends on it. */
export function prerequisiteOrder(scopes: ScopeWithRequirements[]): ScopeWithRequirements[] {
  const byId = new Map(scopes.map((s) => [s.id, s]));
  const done = new Set<string>();
  const out: ScopeWithRequirements[] = [];
  const visit = (s: ScopeWithRequirements, path: Set<string>) => {
    if (done.has(s.id) || path.has(s.id)) return;
    path.add(s.id);
    for (const r of s.requirements) {
      const dep = r.prerequisiteScopeId ? byId.get(r.prerequisiteScopeId) : undefined;
      if (dep) visit(dep, path);
    }
    done.add(s.id);
    out.push(s);
  };
  for (const s of scopes) visit(s, new Set());
  return out;
}

export interface ScopeEligibility {
  scope: ScopeWithRequirements;
  results: RequirementResult[];
  eligible: boolean;
  state: DerivedState;
}

/** Each scope judged for the person now, read-only: what the eligibility breakdown shows. */
export async function eligibilityOf(db: Executor, person: PersonRow, scopes: ScopeWithRequirements[], now: Date): Promise<ScopeEligibility[]> {
  const { facts } = await loadFacts(db, person, scopes, now);
  return judge(facts, scopes, now);
}

/** Eligibility of several people in one set of reads. */
export async function eligibilityOfMany(db: Executor, people: PersonRow[], scopes: ScopeWithRequirements[], now: Date): Promise<Map<string, ScopeEligibility[]>> {
  const all = await loadFactsOfMany(db, people, scopes, now);
  return new Map([...all].map(([id, { facts }]) => [id, judge(facts, scopes, now)]));
}

function judge(facts: EvaluationFacts, scopes: ScopeWithRequirements[], now: Date): ScopeEligibility[] {
  return prerequisiteOrder(scopes).map((scope) => {
    const results = evaluateScope(scope, facts);
    const state = facts.states.get(scope.id) ?? foldState(null, [], now);
    return { scope, results, eligible: results.length > 0 && results.every((r) => r.met), state };
  });
}
