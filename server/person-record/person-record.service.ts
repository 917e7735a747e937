import type { Deps } from '../deps.js';
import { subjectOf, type AppAbility } from '../../shared/abilities.js';
import type { PersonRecordView } from '../../shared/register/views.js';
import type { SignoffRowView, PracticalRowView } from '../../shared/practicals/views.js';
import { accessibleWhere } from '../authz/casl-sql.js';
import { forbidden, notFound } from '../errors.js';
import type { makePeopleService } from '../people/people.service.js';
import type { AuthorisationsFeature } from '../authorisations/index.js';
import { findUserById } from '../people/people.repository.js';
import { findSite } from '../sites/sites.repository.js';
import { eventsOf } from '../authorisations/periods.repository.js';
import { namesOf, signaturesByIds } from '../authorisations/authorisations.repository.js';
import { certificatesOf } from '../authorisations/certificates.repository.js';
import { presentCertificate, presentEvent, presentPeriod } from '../authorisations/present.js';
import { listSignoffs } from '../signoffs/signoffs.list.repository.js';
import { signoffAccessColumns } from '../signoffs/signoffs.repository.js';
import { listPracticals } from '../practicals/practicals.list.repository.js';
import { practicalAccessColumns } from '../practicals/practicals.repository.js';
import { acknowledgementsBy } from '../incident/incident.repository.js';
import { periodsOfHolder, practicalsOf } from './person-record.repository.js';
import { readingsOf } from '../practicals/attempts.present.js';

type Needs = { people: ReturnType<typeof makePeopleService>; authorisations: AuthorisationsFeature };

/** One person in one place, put together from each feature's own services and repositories. */
export function makePersonRecordService(deps: Deps, s: Needs) {
  const { db, clock } = deps;

  async function record(ability: AppAbility, personId: string): Promise<PersonRecordView> {
    const user = await findUserById(db, personId);
    if (!user) throw notFound('That person');
    if (!ability.can('read', subjectOf('PersonRecord', { personId, siteId: user.siteId }))) throw forbidden("You may not see this person's record.");
    const now = clock.now();
    const [detail, site, list, periods, certs, acks, signoffs, practicals] = await Promise.all([
      s.people.get(ability, personId),
      findSite(db, user.siteId),
      s.authorisations.authorisations.list(ability, { holderId: personId, page: 1, pageSize: 200 }),
      periodsOfHolder(db, personId),
      certificatesOf(db, [personId]),
      acknowledgementsBy(db, personId, now),
      listSignoffs(db, { access: accessibleWhere(ability, 'read', 'Signoff', signoffAccessColumns), personId, sort: 'updatedAt', dir: 'desc', page: 1, pageSize: 100 }),
      listPracticals(db, { access: practicalsOf(accessibleWhere(ability, 'read', 'Practical', practicalAccessColumns), personId), sort: 'heldAt', dir: 'desc', page: 1, pageSize: 100 }),
    ]);
    const events = await eventsOf(db, periods.map((p) => p.id));
    const people = [...events.map((e) => e.actorId), ...periods.map((p) => p.issuedBy), ...certs.map((c) => c.reviewedBy)].filter((x): x is string => !!x);
    const [names, sigs] = await Promise.all([namesOf(db, people), signaturesByIds(db, events.map((e) => e.signatureId).filter((x): x is string => !!x))]);
    const tz = site?.timeZone ?? 'UTC';
    const readings = await readingsOf(db, practicals.items.map((r) => r.id), now);
    return {
      person: { ...detail, site: { id: user.siteId, code: site?.code ?? '', name: site?.name ?? '', timeZone: tz } },
      authorisations: list.items.map((a) => ({
        ...a,
        periods: periods.filter((p) => p.authorisationId === a.id).reverse()
          .map((p) => presentPeriod(p, events.filter((e) => e.periodId === p.id).map((e) => presentEvent(e, names, sigs)), tz, names)),
      })),
      certificates: certs.map((c) => presentCertificate(c, { holderName: user.name, siteName: site?.name ?? '', reviewerName: c.reviewedBy ? (names.get(c.reviewedBy) ?? null) : null }, now)),
      acknowledgements: acks.map((a) => ({ procedureCode: a.code, versionNumber: a.versionNumber, acknowledgedAt: a.acknowledgedAt.toISOString(), printedName: a.printedName })),
      signoffs: signoffs.items.map((r) => ({ ...r, kind: r.kind as SignoffRowView['kind'], status: r.status as SignoffRowView['status'], submittedAt: r.submittedAt?.toISOString() ?? null, updatedAt: r.updatedAt.toISOString() })),
      practicals: practicals.items.map((r) => ({
        ...r, status: r.status as PracticalRowView['status'], outcome: r.outcome as PracticalRowView['outcome'], heldAt: r.heldAt.toISOString(), readings: readings.get(r.id) ?? [],
      })),
    };
  }

  return { record };
}
