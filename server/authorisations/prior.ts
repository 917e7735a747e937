import type { Executor } from '../db/client.js';
import { conflict } from '../errors.js';
import type { PersonRow } from './facts.repository.js';
import type { ScopeRow } from './scopes.repository.js';
import { ensureAuthorisation, insertPeriod, overlapping } from './periods.repository.js';
import { newVerificationCode } from './codes.js';
import { endOfLocalDay, formatDay, lastDay, localDate, startOfLocalDay } from './dates.js';
import type { Writer } from './writer.js';

export interface PriorRecord {
  issuedOn: string;
  expiresOn: string;
  attestedBy: string;
  evidenceId: string | null;
  note: string;
  origin: 'prior' | 'imported';
  signatureId: string | null;
  /** Known before it is written, so the signature can name it. */
  periodId: string;
}

/** Problems with a paper record before anything is written, each as [field, message]. */
export function priorProblems(holder: PersonRow, r: Pick<PriorRecord, 'issuedOn' | 'expiresOn'>, now: Date): [string, string][] {
  const out: [string, string][] = [];
  if (!holder.active) out.push(['holderId', 'this person is switched off']);
  if (r.expiresOn <= r.issuedOn) out.push(['expiresOn', 'must be after the issue date']);
  if (r.issuedOn > localDate(now, holder.timeZone)) out.push(['issuedOn', 'cannot be in the future']);
  return out;
}

/**
 * Writes an authorisation held on paper before the portal: a period from the original issue date to the
 * original expiry (local days at the holder's site), marked as recorded from before, with who attested it.
 */
export async function writePrior(tx: Executor, w: Writer, holder: PersonRow, scope: ScopeRow, r: PriorRecord) {
  const startsAt = startOfLocalDay(r.issuedOn, holder.timeZone);
  const endsAt = endOfLocalDay(r.expiresOn, holder.timeZone);
  const clash = await overlapping(tx, holder.id, scope.id, startsAt, endsAt);
  if (clash.length) {
    const c = clash[0];
    const span = `${formatDay(localDate(c.startsAt, holder.timeZone))} to ${formatDay(lastDay(c.endsAt, holder.timeZone))}`;
    throw conflict(`issuedOn: ${holder.name} already holds “${scope.title}” for part of that time (${span})`, { issuedOn: `overlaps a period from ${span}` });
  }
  const auth = await ensureAuthorisation(tx, holder.id, scope.id, w.now);
  const period = await insertPeriod(tx, {
    id: r.periodId, authorisationId: auth.id, holderId: holder.id, scopeId: scope.id, startsAt, endsAt, validityEndsAt: endsAt, origin: r.origin,
    previousPeriodId: null, verificationCode: newVerificationCode(), issuedBy: w.actorId, recordedAt: w.now,
    attestedBy: r.attestedBy, priorEvidenceId: r.evidenceId, priorNote: r.note || null,
    evidenceSnapshot: { evaluatedAt: w.now.toISOString(), completedBy: w.actorId, requirements: [], paperRecord: { attestedBy: r.attestedBy, issuedOn: r.issuedOn, expiresOn: r.expiresOn, note: r.note } },
  });
  const st = { authorisationId: auth.id, period, events: [] };
  await w.event(st, { kind: 'issued', effectiveAt: startsAt, actorId: w.actorId, signatureId: r.signatureId, details: { recordedFromBefore: true, attestedBy: r.attestedBy } });
  if (endsAt <= w.now) await w.event(st, { kind: 'lapsed', effectiveAt: endsAt, reason: 'The paper record had expired before it was entered.' });
  return st;
}
