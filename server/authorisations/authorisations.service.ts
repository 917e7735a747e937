import type { Deps } from '../deps.js';
import { subjectOf, type Actor, type AppAbility } from '../../shared/abilities.js';
import { AUTHORISATION_CAUTION, STATE_LABELS } from '../../shared/authorisations/kinds.js';
import type { AuthorisationsQuery, DueQuery } from '../../shared/schemas/authorisations.js';
import type { AuthorisationDetail, DueView, EligibilityView, MineView } from '../../shared/authorisations/views.js';
import { accessibleWhere } from '../authz/casl-sql.js';
import { forbidden, notFound } from '../errors.js';
import * as repo from './authorisations.repository.js';
import { certificateAccessColumns, certificatesOf, listCertificates } from './certificates.repository.js';
import { findPerson } from './facts.repository.js';
import { eventsOf, periodsOf } from './periods.repository.js';
import { scopesWithRequirements } from './scopes.repository.js';
import { eligibilityOf } from './eligibility.js';
import { stateAt, statesAt, NOT_HELD } from './states.js';
import { presentCertificate, presentEvent, presentPeriod, presentResult, presentSummary } from './present.js';
import { renewHints } from './hints.js';
import { addDays } from './dates.js';

export function makeAuthorisationsService({ db, clock }: Deps) {
  async function readablePerson(ability: AppAbility, personId: string) {
    const person = await findPerson(db, personId);
    if (!person) throw notFound('That person');
    if (!ability.can('read', subjectOf('Authorisation', { holderId: person.id, siteId: person.siteId }))) throw forbidden('You may not see this person\'s authorisations.');
    return person;
  }

  async function summaries(rows: repo.SummaryRow[], now: Date) {
    const states = await statesAt(db, { authorisationIds: rows.map((r) => r.id) }, now);
    return rows.map((r) => presentSummary(r, states.get(r.id) ?? NOT_HELD, now));
  }

  /** "What I may do": the person's authorisations with time left and what to renew, and their certificates. */
  async function mine(actor: Actor): Promise<MineView> {
    const now = clock.now();
    const person = (await findPerson(db, actor.id))!;
    const [rows, scopes, certs] = await Promise.all([repo.summariesOfHolder(db, actor.id), scopesWithRequirements(db), certificatesOf(db, [actor.id])]);
    const eligibility = new Map((await eligibilityOf(db, person, scopes, now)).map((e) => [e.scope.id, e]));
    const items = (await summaries(rows, now)).map((s) => ({ ...s, renew: renewHints(eligibility.get(s.scope.id)!, person.timeZone, now) }));
    const names = await repo.namesOf(db, certs.map((c) => c.reviewedBy).filter((x): x is string => !!x));
    return {
      person: { id: person.id, name: person.name }, caution: AUTHORISATION_CAUTION, items,
      certificates: certs.map((c) => presentCertificate(c, { holderName: person.name, siteName: person.siteName, reviewerName: c.reviewedBy ? (names.get(c.reviewedBy) ?? null) : null }, now)),
    };
  }

  async function list(ability: AppAbility, q: AuthorisationsQuery) {
    const access = accessibleWhere(ability, 'read', 'Authorisation', repo.authorisationAccessColumns);
    const { items, total } = await repo.listSummaries(db, { ...q, access });
    return { items: await summaries(items, clock.now()), total, page: q.page, pageSize: q.pageSize };
  }

  /** In force now and ending within the window, soonest first, per site; and certificates running out there. */
  async function due(ability: AppAbility, q: DueQuery): Promise<DueView> {
    const now = clock.now();
    const until = addDays(now, q.withinDays);
    const access = accessibleWhere(ability, 'read', 'Authorisation', repo.authorisationAccessColumns);
    const { items, total } = await repo.dueSummaries(db, { access, siteId: q.siteId, now, until, page: q.page, pageSize: q.pageSize });
    const certAccess = accessibleWhere(ability, 'read', 'Certificate', certificateAccessColumns);
    const certs = await listCertificates(db, { access: certAccess, siteId: q.siteId, status: 'verified', page: 1, pageSize: 200 });
    const soon = certs.items.filter((c) => c.certificate.validUntil > now && c.certificate.validUntil <= until);
    return {
      items: await summaries(items, now), total, page: q.page, pageSize: q.pageSize,
      certificates: soon.map((c) => presentCertificate(c.certificate, { holderName: c.holderName, siteName: c.siteName, reviewerName: c.reviewerName }, now)),
    };
  }

  async function detail(ability: AppAbility, id: string): Promise<AuthorisationDetail> {
    const row = await repo.summaryOf(db, id);
    if (!row) throw notFound('That authorisation');
    if (!ability.can('read', subjectOf('Authorisation', { holderId: row.holderId, siteId: row.siteId }))) throw forbidden('You may not see this authorisation.');
    const now = clock.now();
    const state = await stateAt(db, { authorisationId: id }, now);
    const periods = await periodsOf(db, id);
    const events = await eventsOf(db, periods.map((p) => p.id));
    const names = await repo.namesOf(db, [...events.map((e) => e.actorId), ...periods.map((p) => p.issuedBy)].filter((x): x is string => !!x));
    const sigs = await repo.signaturesByIds(db, events.map((e) => e.signatureId).filter((x): x is string => !!x));
    return {
      ...presentSummary(row, state, now),
      holds: state.holds.map((h) => ({ cause: h.cause, since: h.since.toISOString(), reason: h.reason, renewalSubmitted: h.renewalSubmitted })),
      periods: periods.reverse().map((p) => presentPeriod(p, events.filter((e) => e.periodId === p.id).map((e) => presentEvent(e, names, sigs)), row.timeZone, names)),
      snapshot: state.period?.evidenceSnapshot ?? null,
    };
  }

  /** Each scope for the person: met with its evidence, or unmet with what is missing. */
  async function eligibility(ability: AppAbility, personId: string, scopeId?: string): Promise<EligibilityView> {
    const person = await readablePerson(ability, personId);
    const now = clock.now();
    const scopes = await scopesWithRequirements(db);
    if (scopeId && !scopes.some((s) => s.id === scopeId)) throw notFound('That scope');
    const all = await eligibilityOf(db, person, scopes, now);
    return {
      person: { id: person.id, name: person.name }, evaluatedAt: now.toISOString(),
      scopes: all.filter((e) => (scopeId ? e.scope.id === scopeId : e.scope.active || e.state.state !== 'none')).map((e) => ({
        scope: { id: e.scope.id, code: e.scope.code, title: e.scope.title, allowsLiveWork: e.scope.allowsLiveWork },
        eligible: e.eligible, state: e.state.state, stateLabel: STATE_LABELS[e.state.state], requirements: e.results.map(presentResult),
      })),
    };
  }

  return { mine, list, due, detail, eligibility };
}
