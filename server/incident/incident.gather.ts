import type { Deps } from '../deps.js';
import type { AppAbility } from '../../shared/abilities.js';
import { CERTIFICATE_KIND_LABELS, type CertificateKind } from '../../shared/authorisations/kinds.js';
import type { RowEvidenceView } from '../../shared/register/views.js';
import { accessibleWhere } from '../authz/casl-sql.js';
import { certificatesOf } from '../authorisations/certificates.repository.js';
import type { PersonRow } from '../authorisations/facts.repository.js';
import { registerAccessColumns, registerRows } from '../register/register.repository.js';
import { filesOf } from '../register/evidence.repository.js';
import type { makeRowEvidence } from '../register/register.evidence.js';
import { acknowledgementsBy, practicalsBy, versionsInForceAt } from './incident.repository.js';
import { benchThen, instrumentsThen } from './equipment.then.js';
import { rereadDeadlinesAt } from './reread.repository.js';
import { gatherRecords } from './records.then.js';
import { findUserById } from '../people/people.repository.js';
import { endOfLocalDay } from '../../shared/time.js';
import type { IncidentPack, PackFile } from './incident.types.js';
import { readingsThen } from './readings.then.js';
import { formatInZone } from '../../shared/time.js';

type Parts = Omit<IncidentPack, 'producedAt' | 'producedBy' | 'note' | 'person'>;

/** Gathers what stood at the moment for one person (and a bench): nothing later, nothing of today's versions. */
export async function gatherPack(deps: Deps, rows: ReturnType<typeof makeRowEvidence>, ability: AppAbility, person: PersonRow, at: Date, benchId?: string): Promise<Parts> {
  const { db } = deps;
  const access = accessibleWhere(ability, 'read', 'Register', registerAccessColumns);
  const held = await registerRows(db, { access, moment: { at, known: false }, personId: person.id }, 'scope', 'asc', 500);
  const authorisations: RowEvidenceView[] = [];
  for (const r of held) authorisations.push(await rows.evidenceOf(ability, r.authorisationId, { at: at.toISOString(), view: 'effective' }));

  const [versions, acks, practicalRows, certs] = await Promise.all([versionsInForceAt(db, at), acknowledgementsBy(db, person.id, at), practicalsBy(db, person.id, at), certificatesOf(db, [person.id])]);
  // The portal's rule (shared/procedures/reread-rule.ts): an earlier acknowledgement counts until the end of the re-read deadline.
  const deadlines = await rereadDeadlinesAt(db, person.id, versions.map((v) => v.versionId), at);
  const procedures = versions.map((v) => {
    const ack = acks.find((a) => a.procedureId === v.procedureId);
    const current = !!ack && ack.versionNumber >= (v.ackFromNumber ?? v.number);
    const dueOn = deadlines.get(v.versionId) ?? null;
    const counts = current || (!!ack && dueOn !== null && at < endOfLocalDay(dueOn, person.timeZone));
    return {
      code: v.code, number: v.number, title: v.title, publishedAt: v.publishedAt!,
      acknowledged: ack ? { number: ack.versionNumber, at: ack.acknowledgedAt, printedName: ack.printedName, counts, current, dueOn: current ? null : dueOn } : null,
    };
  });

  const restedOn = new Set(authorisations.flatMap((a) => a.basis.flatMap((b) => b.evidence.filter((e) => e.type === 'practical').map((e) => e.id))));
  const shownCerts = certs.filter((c) => c.submittedAt <= at);
  const recordFiles = await filesOf(db, [...practicalRows.map((p) => ({ type: 'practical', id: p.practical.id })), ...shownCerts.map((c) => ({ type: 'certificate', id: c.id }))], at);
  const filesFor = (type: string, id: string) => recordFiles.filter((f) => f.entity === type && f.entityId === id);

  const bench = benchId ? await benchThen(db, benchId, at) : null;
  const usedInstruments = [...new Set(practicalRows.flatMap((p) => p.practical.instrumentIds))];
  const instruments = await instrumentsThen(db, bench?.siteId ?? null, usedInstruments, at, bench?.timeZone ?? person.timeZone);

  const readings = await readingsThen(db, practicalRows.map((p) => p.practical.id), at, (d) => formatInZone(d, person.timeZone));
  const account = (await findUserById(db, person.id))!;
  const records = await gatherRecords(db, at, person.id, account.createdAt, practicalRows.map((p) => p.practical), authorisations, benchId);
  const files: PackFile[] = [...recordFiles, ...(bench?.latestCheck?.files ?? []), ...records.signoffs.flatMap((s) => s.files)];
  for (const a of authorisations) for (const b of a.basis) for (const e of b.evidence) for (const f of e.files) files.push({ ...f, entity: e.type, entityId: e.id });
  return {
    at, authorisations, procedures, bench, instruments, records,
    practicals: practicalRows.map(({ practical: p, assessorName }) => ({
      id: p.id, heldAt: p.heldAt, assessorName, restedOn: restedOn.has(p.id), files: filesFor('practical', p.id), readings: readings.get(p.id) ?? [],
      outcome: p.assessedAt && p.assessedAt <= at ? (p.outcome === 'competent' ? 'Competent' : 'Not yet competent') : 'Not yet assessed at that moment',
    })),
    certificates: shownCerts.map((c) => ({
      id: c.id, kind: CERTIFICATE_KIND_LABELS[c.kind as CertificateKind] ?? c.kind, issuer: c.issuer, reference: c.reference, issuedOn: c.issuedOn, expiresOn: c.expiresOn,
      files: filesFor('certificate', c.id),
      stateThen: c.reviewedAt && c.reviewedAt <= at ? (c.status === 'verified' ? (c.validUntil > at ? 'Checked and current' : 'Checked, expired by then') : 'Rejected') : 'Uploaded, not yet checked',
    })),
    files: dedupe(files),
  };
}

const dedupe = (files: PackFile[]) => [...new Map(files.map((f) => [`${f.entity}/${f.entityId}/${f.id}`, f])).values()];
