import { createHash } from 'node:crypto';
import type { Executor } from '../db/client.js';
import type { Audit } from '../audit/audit.service.js';
import type { SeedContext } from './index.js';
import { ACKNOWLEDGED_MEANING, ASSESSED_MEANING } from '../../shared/practicals/terms.js';
import { computeExpectations, type Expectations } from '../../shared/practicals/expectations.js';
import { judgeReading } from '../../shared/practicals/entries.js';
import { circuitSchema } from '../../shared/schemas/practicals.js';
import { findBenchByCode } from '../benches/benches.repository.js';
import { findInstrumentByIdentity } from '../benches/instruments.repository.js';
import { insertEvidence } from '../evidence/evidence.repository.js';
import { holdPointsOf, type RecordChecklist } from '../records/checklist.js';
import type { EntryFields } from '../records/records.repository.js';
import * as repo from '../practicals/practicals.repository.js';
import { keepAttempt } from '../practicals/attempts.js';
import { seedSign, tickEntry } from './seed-records.js';
import { scopeCapturePng } from './seed-scope-capture.js';

// A 200 W, 230 V resistive test load (264.5 Ω) on the controller at the mid setting of its 470 kΩ potentiometer.
const CIRCUIT = circuitSchema.parse({
  load: { kind: 'rated', ratedPowerW: 200, ratedVoltageV: 230 },
  trigger: { fixedResistanceOhms: 3300, potentiometerOhms: 470_000, setting: 0.5, capacitanceF: 100e-9, breakoverV: 32, breakbackV: 6, latchingCurrentA: 0.04, holdingCurrentA: 0.025, gateTriggerCurrentA: 0.025, gateTriggerVoltageV: 1 },
  thermal: { thresholdVoltageV: 1.1, slopeResistanceOhms: 0.05, rthJunctionCaseKW: 3, rthCaseSinkKW: 0.5, rthSinkAmbientKW: 12, ambientC: 25, maxJunctionC: 125 },
});

interface Practicals {
  procedureId: string;
  versionId: string;
  siteId: string;
  checklist: RecordChecklist;
  assessorId: string;
  competent: { technicianId: string; at: Date };
  notYet: { technicianId: string; at: Date };
}

export async function seedPracticals(tx: Executor, audit: Audit, ctx: SeedContext, s: Practicals) {
  const bench = (await findBenchByCode(tx, ctx.sites['LEJ-W1'], 'LEJ-B1'))!;
  const benchRow = (await repo.benchOf(tx, bench.id))!;
  const expectations = computeExpectations(CIRCUIT, { voltageRms: benchRow.supplyVoltage, frequencyHz: benchRow.supplyFrequency });
  const ids = async (make: string, model: string, serial: string) => (await findInstrumentByIdentity(tx, make, model, serial))!.id;
  const instruments = { meter: await ids('Ohmwerk', 'DM 61', 'OW61-20417'), insulation: await ids('Ohmwerk', 'IR 25', 'OW25-00388'), probe: await ids('Brightline', 'DP 70', 'BL70-5531') };
  const q = expectations.quantities;
  // Readings a little off the engine's figures, as a real bench gives them; the second practical's output is far too low.
  const readings = (good: boolean): Record<string, [number, string]> => ({
    'Insulation resistance': [good ? 240 : 180, instruments.insulation],
    'Output RMS voltage': [good ? Math.round(q['output-rms-voltage']! * 1.03) : Math.round(q['output-rms-voltage']! * 0.8), instruments.meter],
    'Firing angle': [good ? Math.round(q['firing-angle']! - 4) : Math.round(q['firing-angle']! + 6), instruments.probe],
  });
  const open = { ...s, benchId: bench.id, instrumentIds: Object.values(instruments), expectations };
  await one(tx, audit, { ...open, ...s.competent, outcome: 'competent', readings: readings(true), comment: 'Waited at the hold point, kept hands clear while energised, proved dead before removing the clips.' });
  await one(tx, audit, { ...open, ...s.notYet, outcome: 'not_yet_competent', readings: readings(false), comment: 'Output far below the expected value: the potentiometer was not at the mid mark and the reading was not questioned. Repeat after revising the set-up.' });
}

type One = Omit<Practicals, 'competent' | 'notYet'> & {
  benchId: string; instrumentIds: string[]; expectations: Expectations; technicianId: string; at: Date;
  outcome: 'competent' | 'not_yet_competent'; readings: Record<string, [number, string]>; comment: string;
};

async function one(tx: Executor, audit: Audit, p: One) {
  const minute = (n: number) => new Date(p.at.getTime() + n * 60_000);
  const row = await repo.insertPractical(tx, {
    technicianId: p.technicianId, assessorId: p.assessorId, siteId: p.siteId, benchId: p.benchId, procedureId: p.procedureId, versionId: p.versionId,
    checklistId: p.checklist.id, instrumentIds: p.instrumentIds, circuit: CIRCUIT, expectations: p.expectations, status: 'in_progress', heldAt: p.at, createdAt: p.at, updatedAt: p.at,
  });
  const holds = await holdPointsOf(tx, p.versionId);
  for (const [i, h] of holds.entries()) {
    await repo.insertHoldPoint(tx, { practicalId: row.id, stepKey: h.key, position: h.position, witnessedAt: minute(10 + i * 5), witnessedBy: p.assessorId, note: null, seq: i + 1 });
  }
  const png = scopeCapturePng(p.expectations.firing?.angleDeg ?? 90);
  const ev = await insertEvidence(tx, {
    ownerId: p.technicianId, siteId: p.siteId, uploaderId: p.assessorId, entity: 'practical', entityId: row.id, fileName: 'scope-mid-setting.png', mediaType: 'image/png',
    sizeBytes: png.length, sha256: createHash('sha256').update(png).digest('hex'), caption: 'Phase-cut output at the mid setting (differential probe)', content: png, uploadedAt: minute(30),
  });
  for (const [i, item] of p.checklist.items.entries()) {
    const at = minute(15 + i * 3);
    const reading = Object.entries(p.readings).find(([prefix]) => item.prompt.startsWith(prefix))?.[1];
    let fields: EntryFields = tickEntry(at, p.assessorId);
    if (item.kind === 'measurement' && reading) {
      const j = judgeReading(item.rule!, item.unit!, reading[0], p.expectations.quantities);
      fields = { ...fields, kind: 'measurement', checked: null, value: reading[0], unit: item.unit, instrumentId: reading[1], expected: j.expected, tolerance: j.tolerance, verdict: j.verdict, judgedBy: j.judgedBy, ruleText: j.ruleText, source: j.source };
    } else if (item.kind === 'evidence') fields = { ...fields, kind: 'evidence', checked: null, evidenceId: ev.id };
    else if (item.kind === 'text') fields = { ...fields, kind: 'text', checked: null, text: p.outcome === 'competent' ? 'Methodical; kept the test area clear.' : 'Did not check the setting before reading.' };
    else if (item.kind !== 'tick') throw new Error(`seed: no demo entry for "${item.prompt}"`);
    const seq = holds.length + i + 1;
    if (fields.kind === 'measurement') await keepAttempt(tx, { id: row.id, itemId: item.id, seq, fields, reason: null, now: at, actorId: p.assessorId });
    await repo.saveEntry(tx, row.id, item.id, { ...fields, seq });
  }
  const assessed = await seedSign(tx, p.assessorId, ASSESSED_MEANING, 'practical', row.id, minute(45));
  await repo.updatePractical(tx, row.id, { status: 'assessed', outcome: p.outcome, outcomeComment: p.comment, assessedAt: minute(45), assessorSignatureId: assessed.id, updatedAt: minute(45) });
  const acknowledged = await seedSign(tx, p.technicianId, ACKNOWLEDGED_MEANING, 'practical', row.id, minute(47));
  await repo.updatePractical(tx, row.id, { status: 'acknowledged', acknowledgedAt: minute(47), technicianSignatureId: acknowledged.id, updatedAt: minute(47) });
  await audit(tx, { actorId: null, action: 'seed.practical', entity: 'practical', entityId: row.id, newValues: { technicianId: p.technicianId, outcome: p.outcome } });
}
