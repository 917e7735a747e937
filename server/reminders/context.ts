import type { Executor } from '../db/client.js';
import type { Config } from '../config.js';
import { STATE_LABELS, type CertificateKind } from '../../shared/authorisations/kinds.js';
import { summaryOf, summariesOf } from '../authorisations/authorisations.repository.js';
import { findCertificate } from '../authorisations/certificates.repository.js';
import { findPeople, findPerson } from '../authorisations/facts.repository.js';
import { findPeriod, findPeriods, eventsOf } from '../authorisations/periods.repository.js';
import { scopesWithRequirements, type ScopeWithRequirements } from '../authorisations/scopes.repository.js';
import { eligibilityOf, eligibilityOfMany, type ScopeEligibility } from '../authorisations/eligibility.js';
import { renewHints } from '../authorisations/hints.js';
import { foldState, statesAt } from '../authorisations/states.js';
import { daysLeft, lastDay } from '../authorisations/dates.js';
import { authorisationMail, certificateMail, type Mail } from './messages.js';
import type { SendRow } from './reminders.repository.js';

const DAY_MS = 86_400_000;

/** Reads each thing once per batch: the holder and each manager get a message about the same record. */
function memo<K, V>(load: (key: K) => Promise<V>) {
  const seen = new Map<K, Promise<V>>();
  const get = (key: K) => {
    let v = seen.get(key);
    if (!v) seen.set(key, (v = load(key)));
    return v;
  };
  /** Fills in what a bulk read already has. */
  get.prime = (key: K, value: V) => seen.set(key, Promise.resolve(value));
  return get;
}

/**
 * Composes the messages of one delivery batch from what stands now. Reads run one after another (the
 * batch runs on one transaction's connection); what several sends share is read once.
 */
export function mailComposer(db: Executor, config: Config, now: Date) {
  let allScopes: Promise<ScopeWithRequirements[]> | undefined;
  const scopes = () => (allScopes ??= scopesWithRequirements(db));
  const person = memo((id: string) => findPerson(db, id));
  const eligibility = memo(async (id: string): Promise<ScopeEligibility[]> => {
    const holder = await person(id);
    return holder ? eligibilityOf(db, holder, await scopes(), now) : [];
  });
  const periodFacts = memo(async (id: string) => {
    const period = await findPeriod(db, id);
    const row = period && (await summaryOf(db, period.authorisationId));
    const holder = row && (await person(row.holderId));
    if (!period || !row || !holder) return null;
    return { period, row, holder, events: await eventsOf(db, [period.id]) };
  });
  const certificateFacts = memo(async (id: string) => {
    const cert = await findCertificate(db, id);
    const holder = cert && (await person(cert.holderId));
    if (!cert || !holder) return null;
    const resting = (await scopes()).filter((s) => s.requirements.some((r) => r.kind === 'certificate' && r.certificateKind === cert.kind));
    const states = await statesAt(db, { holderIds: [holder.id], scopeIds: resting.map((s) => s.id) }, now);
    const held = resting.filter((s) => [...states.values()].some((st) => st.period?.scopeId === s.id && st.period.endsAt > now));
    return { cert, holder, held };
  });

  /** Reads the periods of a batch, their summaries, events, holders and holders' eligibility in a few queries, not per send. */
  async function prefetch(sends: SendRow[]) {
    const periods = await findPeriods(db, [...new Set(sends.flatMap((s) => (s.periodId ? [s.periodId] : [])))]);
    const rows = new Map((await summariesOf(db, [...new Set(periods.map((p) => p.authorisationId))])).map((r) => [r.id, r]));
    const events = await eventsOf(db, periods.map((p) => p.id));
    const people = new Map((await findPeople(db, [...new Set([...rows.values()].map((r) => r.holderId))])).map((p) => [p.id, p]));
    for (const p of people.values()) person.prime(p.id, p);
    const judged = await eligibilityOfMany(db, [...people.values()], await scopes(), now);
    for (const [id, e] of judged) eligibility.prime(id, e);
    for (const period of periods) {
      const row = rows.get(period.authorisationId);
      const holder = row && people.get(row.holderId);
      if (row && holder) periodFacts.prime(period.id, { period, row, holder, events: events.filter((e) => e.periodId === period.id) });
    }
  }

  /** The message for one recorded send; null when there is nothing (left) to say. */
  async function compose(send: SendRow, recipientName: string): Promise<Mail | null> {
    const toHolder = send.recipientRole === 'holder';
    return send.periodId ? periodMail(send, toHolder, recipientName) : certificateMailFor(send, toHolder, recipientName);
  }

  async function periodMail(send: SendRow, toHolder: boolean, recipientName: string) {
    const f = await periodFacts(send.periodId!);
    if (!f) return null;
    const { period, row, events } = f;
    const state = foldState(period, events, now);
    if (send.offsetDays > 0) {
      // A reminder for a period that was renewed, revoked or ended meanwhile has nothing to remind of;
      // one about an end that has moved since it was planned would give the wrong date.
      if (period.endsAt <= now || state.state === 'revoked' || state.state === 'ended') return null;
      if (!sameEnd(send, period.endsAt)) return null;
    }
    const elig = (await eligibility(f.holder.id)).find((e) => e.scope.id === row.scopeId);
    if (!elig) return null;
    const hints = renewHints({ ...elig, state: send.offsetDays > 0 ? state : elig.state }, f.holder.timeZone, now);
    const link = toHolder ? `${config.publicUrl}/authorisations/mine` : `${config.publicUrl}/authorisations/${row.id}`;
    return authorisationMail({
      holderName: row.holderName, siteName: row.siteName, scopeCode: row.code, scopeTitle: row.title,
      limits: `up to ${row.maxVoltageV} V / ${row.maxCurrentA} A${row.allowsLiveWork ? ', live work' : ', dead work only'}`,
      validUntil: lastDay(period.endsAt, row.timeZone), daysLeft: daysLeft(period.endsAt, now, row.timeZone),
      state: STATE_LABELS[state.state], hints, lapseReason: events.find((e) => e.kind === 'lapsed')?.reason ?? null,
    }, send.offsetDays, toHolder, recipientName, link);
  }

  async function certificateMailFor(send: SendRow, toHolder: boolean, recipientName: string) {
    const f = await certificateFacts(send.certificateId!);
    if (!f) return null;
    const { cert, holder, held } = f;
    const live = held.filter((s: ScopeWithRequirements) => s.allowsLiveWork);
    const link = toHolder ? `${config.publicUrl}/certificates` : `${config.publicUrl}/certificates?holderId=${holder.id}`;
    return certificateMail({
      holderName: holder.name, siteName: holder.siteName, kind: cert.kind as CertificateKind, expiresOn: cert.expiresOn,
      daysLeft: daysLeft(cert.validUntil, now, holder.timeZone),
      restingScopes: held.map((s) => `${s.code} “${s.title}”`), liveWorkGrace: live.length ? Math.min(...live.map((s) => s.certificateGraceDays)) : null,
    }, send.offsetDays, toHolder, recipientName, link);
  }

  return { prefetch, compose };
}

/**
 * Whether the send was planned for this end: its due moment is the end less the offset in calendar days
 * (as the database computes it on a UTC session, so whole days of 24 hours).
 */
function sameEnd(send: SendRow, endsAt: Date): boolean {
  return send.dueAt.getTime() + send.offsetDays * DAY_MS === endsAt.getTime();
}

