import { benchFlags, instrumentFlags, type BenchState, type InstrumentState } from '../../shared/equipment.js';
import type { BenchRow, RcdType } from '../../shared/schemas/benches.js';
import type { InstrumentKind, InstrumentRow } from '../../shared/schemas/instruments.js';
import type { BenchView, CheckRow } from './benches.repository.js';
import type { InstrumentView } from './instruments.repository.js';

export function benchState(v: BenchView): BenchState {
  const b = v.bench;
  const latestCheck = v.checkAt && v.checkPassed !== null ? { at: v.checkAt, passed: v.checkPassed, notes: v.checkNotes } : null;
  return { ...b, rcdType: b.rcdType as RcdType | null, latestCheck };
}

export function presentBench(v: BenchView, at: Date): BenchRow {
  const b = v.bench;
  const state = benchState(v);
  return {
    id: b.id, siteId: b.siteId, siteCode: v.siteCode, siteName: v.siteName, timeZone: v.timeZone, code: b.code, name: b.name,
    supplyVoltage: b.supplyVoltage, supplyFrequency: b.supplyFrequency as 50 | 60, isolatingTransformer: b.isolatingTransformer,
    isolatingTransformerVa: b.isolatingTransformerVa, rcdType: state.rcdType, rcdRatedResidualMa: b.rcdRatedResidualMa,
    emergencyStop: b.emergencyStop, nextInspectionOn: b.nextInspectionOn, notes: b.notes, active: b.active,
    latestCheck: state.latestCheck && { ...state.latestCheck, at: new Date(state.latestCheck.at).toISOString() },
    flags: benchFlags(state, at, v.timeZone),
    createdAt: b.createdAt.toISOString(), updatedAt: b.updatedAt.toISOString(),
  };
}

export function instrumentState(v: InstrumentView): InstrumentState {
  return { ...v.instrument, kind: v.instrument.kind as InstrumentKind };
}

export function presentInstrument(v: InstrumentView, at: Date): InstrumentRow {
  const i = v.instrument;
  return {
    id: i.id, siteId: i.siteId, siteCode: v.siteCode, siteName: v.siteName, timeZone: v.timeZone, kind: i.kind as InstrumentKind,
    make: i.make, model: i.model, serial: i.serial, measurementCategory: i.measurementCategory as InstrumentRow['measurementCategory'],
    voltageRating: i.voltageRating, trueRms: i.trueRms, calibrationDueOn: i.calibrationDueOn, notes: i.notes, active: i.active,
    flags: instrumentFlags(instrumentState(v), at, v.timeZone),
    createdAt: i.createdAt.toISOString(), updatedAt: i.updatedAt.toISOString(),
  };
}

export function presentCheck(c: CheckRow, personName: string) {
  return { id: c.id, benchId: c.benchId, personId: c.personId, personName, at: c.at.toISOString(), passed: c.passed, notes: c.notes, checklistResponseId: c.checklistResponseId };
}
