import type { SeedStep } from './index.js';
import type { Executor } from '../db/client.js';
import type { Audit } from '../audit/audit.service.js';
import { COMPLETED_MEANING, COUNTERSIGNED_MEANING } from '../../shared/practicals/terms.js';
import { findUserById } from '../people/people.repository.js';
import { insertSignature } from '../signatures/signatures.repository.js';
import { findProcedureByCode, publishedVersion } from '../procedures/procedures.repository.js';
import { checklistOf, type RecordChecklist } from '../records/checklist.js';
import { loadChecklists } from '../procedures/content.repository.js';
import * as signoffs from '../signoffs/signoffs.repository.js';
import { seedPracticals } from './seed-practicals.js';

const DAY = 86_400_000;
const PROCEDURE = 'BO-LIVE-02';

/** Signs as the seeded person, with the name printed as it is now. */
export async function seedSign(tx: Executor, signerId: string, meaning: string, entity: string, entityId: string, signedAt: Date) {
  const person = (await findUserById(tx, signerId))!;
  return insertSignature(tx, { signerId, printedName: person.name, meaning, entity, entityId, signedAt });
}

export const tickEntry = (at: Date, by: string) => ({
  kind: 'tick', checked: true, text: null, evidenceId: null, value: null, didNotTrip: false, unit: null, instrumentId: null,
  expected: null, tolerance: null, verdict: null, judgedBy: null, ruleText: null, source: null, note: null, recordedAt: at, recordedBy: by,
});

/**
 * The demo's sign-offs and practicals on the live commissioning procedure: Tomasz's self sign-off
 * countersigned by Priya, Amélie's waiting for a countersignature, and two practicals on bench LEJ-B1.
 * Invented data; the expected values come from the engine.
 */
export const seedRecords: SeedStep = async (tx, clock, audit, ctx) => {
  const now = clock.now().getTime();
  const ago = (days: number, minutes = 0) => new Date(now - days * DAY + minutes * 60_000);
  const procedure = await findProcedureByCode(tx, PROCEDURE);
  const version = procedure && (await publishedVersion(tx, procedure.id));
  if (!procedure || !version) throw new Error(`seed: the demo procedure ${PROCEDURE} is not published`);
  const lists = await loadChecklists(tx, version.id);
  const byKind = async (kind: string) => checklistOf(tx, version.id, lists.find((l) => l.kind === kind)!.id!);
  const [self, practical] = [await byKind('self-sign-off'), await byKind('practical-assessment')];
  const person = (email: string) => ctx.people[email];
  const [tomasz, amelie, priya] = [person('technician@demo.breakover.test'), person('technician2@demo.breakover.test'), person('assessor@demo.breakover.test')];
  const base = { procedureId: procedure.id, versionId: version.id, siteId: ctx.sites['LEJ-W1'] };
  await seedSignoff(tx, audit, { ...base, checklist: self, personId: tomasz, submittedAt: ago(11), review: { by: priya, at: ago(10) } });
  await seedSignoff(tx, audit, { ...base, checklist: self, personId: amelie, submittedAt: ago(1) });
  await seedPracticals(tx, audit, ctx, { ...base, checklist: practical, assessorId: priya, competent: { technicianId: tomasz, at: ago(12) }, notYet: { technicianId: amelie, at: ago(5) } });
};

interface SeedSignoff {
  procedureId: string;
  versionId: string;
  siteId: string;
  checklist: RecordChecklist;
  personId: string;
  submittedAt: Date;
  review?: { by: string; at: Date };
}

async function seedSignoff(tx: Executor, audit: Audit, s: SeedSignoff) {
  const opened = new Date(s.submittedAt.getTime() - 20 * 60_000);
  const row = await signoffs.insertSignoff(tx, {
    kind: 'self-sign-off', personId: s.personId, siteId: s.siteId, procedureId: s.procedureId, versionId: s.versionId, checklistId: s.checklist.id,
    status: 'in_progress', createdAt: opened, updatedAt: s.submittedAt,
  });
  // The seeded checklist has tick items only: each ticked a few minutes apart.
  if (s.checklist.items.some((i) => i.kind !== 'tick')) throw new Error('seed: the demo self sign-off was expected to hold tick items only');
  for (const [i, item] of s.checklist.items.entries()) await signoffs.saveEntry(tx, row.id, item.id, tickEntry(new Date(opened.getTime() + (i + 1) * 5 * 60_000), s.personId));
  const signed = await seedSign(tx, s.personId, COMPLETED_MEANING, 'signoff', row.id, s.submittedAt);
  await signoffs.updateSignoff(tx, row.id, { status: 'submitted', submittedAt: s.submittedAt, submitSignatureId: signed.id });
  if (s.review) {
    const counter = await seedSign(tx, s.review.by, COUNTERSIGNED_MEANING, 'signoff', row.id, s.review.at);
    await signoffs.updateSignoff(tx, row.id, { status: 'countersigned', reviewedBy: s.review.by, reviewedAt: s.review.at, reviewSignatureId: counter.id, updatedAt: s.review.at });
  }
  await audit(tx, { actorId: null, action: 'seed.signoff', entity: 'signoff', entityId: row.id, newValues: { personId: s.personId, status: s.review ? 'countersigned' : 'submitted' } });
}
