import type { Deps } from '../deps.js';
import { subjectOf, type AppAbility } from '../../shared/abilities.js';
import { AUTHORISATION_CAUTION, PRIOR_LABEL, STATE_LABELS } from '../../shared/authorisations/kinds.js';
import type { VerificationView } from '../../shared/authorisations/views.js';
import { formatInZone } from '../../shared/time.js';
import { AppError, forbidden, notFound } from '../errors.js';
import { namesOf, summaryOf } from './authorisations.repository.js';
import { findPeriod, findPeriodByCode, latestPeriods } from './periods.repository.js';
import { findPerson } from './facts.repository.js';
import { scopesWithRequirements } from './scopes.repository.js';
import { stateAt } from './states.js';
import { certificatePdf } from './certificate-pdf.js';
import { normaliseCode } from './codes.js';
import { formatDay, lastDay, localDate } from './dates.js';
import { isPriorOrigin } from './present.js';
import type { EvidenceSnapshot } from './snapshot.js';

/** The printable certificate of one period, and the public check of its code. */
export function makeCertificateService({ db, clock, config }: Deps) {
  const verifyUrl = (code: string) => `${config.publicUrl}/verify/${code}`;

  async function pdf(ability: AppAbility, authorisationId: string, periodId?: string) {
    const row = await summaryOf(db, authorisationId);
    if (!row) throw notFound('That authorisation');
    if (!ability.can('read', subjectOf('Authorisation', { holderId: row.holderId, siteId: row.siteId }))) throw forbidden('You may not see this authorisation.');
    const now = clock.now();
    const period = periodId ? await findPeriod(db, periodId) : (await latestPeriods(db, { authorisationIds: [authorisationId] }, now))[0];
    if (!period || period.authorisationId !== authorisationId) throw notFound('That period of the authorisation');
    const [scope] = await scopesWithRequirements(db, [row.scopeId]);
    const state = await stateAt(db, { authorisationId }, now);
    const current = state.period?.id === period.id ? STATE_LABELS[state.state] : 'Not current (a later period or change replaced this one)';
    const names = await namesOf(db, period.issuedBy ? [period.issuedBy] : []);
    const by = period.issuedBy ? names.get(period.issuedBy) : null;
    const snap = period.evidenceSnapshot as EvidenceSnapshot;
    const issuer = isPriorOrigin(period.origin)
      ? `${PRIOR_LABEL}: attested by ${period.attestedBy}; entered by ${by ?? 'a manager'} on ${formatDay(localDate(period.recordedAt, row.timeZone))}.`
      : `By the portal on ${formatInZone(period.startsAt, row.timeZone)}, when the last requirement was met${by ? ` (recorded by ${by})` : ''}.`;
    const evidence = snap.paperRecord
      ? [`Paper record from ${formatDay(snap.paperRecord.issuedOn)} to ${formatDay(snap.paperRecord.expiresOn)}, attested by ${snap.paperRecord.attestedBy}${snap.paperRecord.note ? `: ${snap.paperRecord.note}` : ''}`]
      : snap.requirements.flatMap((r) => (r.evidence.length ? r.evidence.map((e) => `${r.label}: ${e.label}`) : [`${r.label}: ${r.detail}`]));
    if (snap.expirySetBy) evidence.push(`Expiry set by ${snap.expirySetBy}.`);
    const bytes = await certificatePdf({
      holderName: row.holderName, siteName: row.siteName, scopeCode: row.code, scopeTitle: row.title, scopeDescription: scope?.description ?? '',
      limits: `up to ${row.maxVoltageV} V and ${row.maxCurrentA} A${row.allowsLiveWork ? ', live work allowed within these limits' : ', dead work only'}`,
      validFrom: formatDay(localDate(period.startsAt, row.timeZone)), validUntil: formatDay(lastDay(period.endsAt, row.timeZone)),
      stateLine: current, issuer, evidence, verificationCode: period.verificationCode, verifyUrl: verifyUrl(period.verificationCode),
      caution: AUTHORISATION_CAUTION, producedAt: formatInZone(now, row.timeZone),
    });
    return { bytes, fileName: `authorisation-${row.code}-${period.verificationCode.slice(0, 8)}.pdf` };
  }

  /** Public: holder, scope, validity and whether it is current, for a known code; nothing else, and no reason. */
  async function verify(raw: string): Promise<VerificationView> {
    const code = normaliseCode(raw);
    const period = code ? await findPeriodByCode(db, code) : undefined;
    if (!period) throw new AppError(404, 'not_found', 'not found');
    const holder = (await findPerson(db, period.holderId))!;
    const [scope] = await scopesWithRequirements(db, [period.scopeId]);
    const state = await stateAt(db, { authorisationId: period.authorisationId }, clock.now());
    const current = state.state === 'active' && state.period?.id === period.id;
    return {
      holderName: holder.name, scopeTitle: scope.title,
      validFrom: localDate(period.startsAt, holder.timeZone), validUntil: lastDay(period.endsAt, holder.timeZone),
      state: current ? 'current' : 'not current',
    };
  }

  return { pdf, verify, verifyUrl };
}
