import type { Executor } from '../db/client.js';
import type { Config } from '../config.js';
import { STATE_LABELS, type CertificateKind } from '../../shared/authorisations/kinds.js';
import { summaryOf } from '../authorisations/authorisations.repository.js';
import { findCertificate } from '../authorisations/certificates.repository.js';
import { findPerson } from '../authorisations/facts.repository.js';
import { findPeriod, eventsOf } from '../authorisations/periods.repository.js';
import { scopesWithRequirements } from '../authorisations/scopes.repository.js';
import { eligibilityOf } from '../authorisations/eligibility.js';
import { renewHints } from '../authorisations/hints.js';
import { foldState, statesAt } from '../authorisations/states.js';
import { daysLeft, lastDay } from '../authorisations/dates.js';
import { authorisationMail, certificateMail, type Mail } from './messages.js';
import type { SendRow } from './reminders.repository.js';

/** The message for one recorded send, from what stands now; null when there is nothing left to say. */
export async function mailFor(db: Executor, config: Config, send: SendRow, recipientName: string, now: Date): Promise<Mail | null> {
  const toHolder = send.recipientRole === 'holder';
  return send.periodId ? periodMail(db, config, send, toHolder, recipientName, now) : certificateMailFor(db, config, send, toHolder, recipientName, now);
}

async function periodMail(db: Executor, config: Config, send: SendRow, toHolder: boolean, recipientName: string, now: Date) {
  const period = await findPeriod(db, send.periodId!);
  const row = period && (await summaryOf(db, period.authorisationId));
  const holder = row && (await findPerson(db, row.holderId));
  if (!period || !row || !holder) return null;
  const events = await eventsOf(db, [period.id]);
  const state = foldState(period, events, now);
  // A reminder for a period that was renewed, revoked or ended meanwhile has nothing to remind of.
  if (send.offsetDays > 0 && (period.endsAt <= now || state.state === 'revoked' || state.state === 'ended')) return null;
  const scopes = await scopesWithRequirements(db);
  const elig = (await eligibilityOf(db, holder, scopes, now)).find((e) => e.scope.id === row.scopeId)!;
  const hints = renewHints({ ...elig, state: send.offsetDays > 0 ? state : elig.state }, holder.timeZone, now);
  const link = toHolder ? `${config.publicUrl}/authorisations/mine` : `${config.publicUrl}/authorisations/${row.id}`;
  return authorisationMail({
    holderName: row.holderName, siteName: row.siteName, scopeCode: row.code, scopeTitle: row.title,
    limits: `up to ${row.maxVoltageV} V / ${row.maxCurrentA} A${row.allowsLiveWork ? ', live work' : ', dead work only'}`,
    validUntil: lastDay(period.endsAt, row.timeZone), daysLeft: daysLeft(period.endsAt, now, row.timeZone),
    state: STATE_LABELS[state.state], hints, lapseReason: events.find((e) => e.kind === 'lapsed')?.reason ?? null,
  }, send.offsetDays, toHolder, recipientName, link);
}

async function certificateMailFor(db: Executor, config: Config, send: SendRow, toHolder: boolean, recipientName: string, now: Date) {
  const cert = await findCertificate(db, send.certificateId!);
  const holder = cert && (await findPerson(db, cert.holderId));
  if (!cert || !holder) return null;
  const scopes = (await scopesWithRequirements(db)).filter((s) => s.requirements.some((r) => r.kind === 'certificate' && r.certificateKind === cert.kind));
  const states = await statesAt(db, { holderIds: [holder.id], scopeIds: scopes.map((s) => s.id) }, now);
  const held = scopes.filter((s) => [...states.values()].some((st) => st.period?.scopeId === s.id && st.period.endsAt > now));
  const live = held.filter((s) => s.allowsLiveWork);
  const link = toHolder ? `${config.publicUrl}/certificates` : `${config.publicUrl}/certificates?holderId=${holder.id}`;
  return certificateMail({
    holderName: holder.name, siteName: holder.siteName, kind: cert.kind as CertificateKind, expiresOn: cert.expiresOn,
    daysLeft: daysLeft(cert.validUntil, now, holder.timeZone),
    restingScopes: held.map((s) => `${s.code} “${s.title}”`), liveWorkGrace: live.length ? Math.min(...live.map((s) => s.certificateGraceDays)) : null,
  }, send.offsetDays, toHolder, recipientName, link);
}
