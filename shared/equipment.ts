// How a bench or a test instrument stands at a moment: pure, so the server decides and the client can explain.
import { endOfLocalDay, localDate } from './time.js';
import type { EquipmentFlag } from './schemas/equipment-common.js';
import { RMS_READING_KINDS, type InstrumentKind, type RcdType } from './equipment-terms.js';

export const DUE_SOON_DAYS = 30;

function daysUntil(isoDate: string, at: Date, tz: string): number {
  return (Date.parse(`${isoDate}T00:00:00Z`) - Date.parse(`${localDate(at, tz)}T00:00:00Z`)) / 86_400_000;
}

export interface BenchState {
  code: string;
  active: boolean;
  isolatingTransformer: boolean;
  rcdType: RcdType | null;
  rcdRatedResidualMa: number | null;
  emergencyStop: boolean;
  nextInspectionOn: string;
  latestCheck: { at: Date | string; passed: boolean; notes: string | null } | null;
}

export function benchFlags(b: BenchState, at: Date, tz: string): EquipmentFlag[] {
  const f: EquipmentFlag[] = [];
  const refuse = (code: string, field: string, message: string) => f.push({ code, severity: 'refuse', field, message });
  const warn = (code: string, field: string, message: string) => f.push({ code, severity: 'warn', field, message });
  if (!b.active) refuse('out_of_service', 'active', `bench ${b.code} is out of service`);
  // A date-only due date holds to the end of that day where the bench stands.
  if (at >= endOfLocalDay(b.nextInspectionOn, tz)) refuse('inspection_overdue', 'nextInspectionOn', `bench ${b.code} inspection was due on ${b.nextInspectionOn}`);
  else if (daysUntil(b.nextInspectionOn, at, tz) <= DUE_SOON_DAYS) warn('inspection_due', 'nextInspectionOn', `bench ${b.code} inspection is due on ${b.nextInspectionOn}`);
  if (b.latestCheck && !b.latestCheck.passed) {
    const on = localDate(new Date(b.latestCheck.at), tz);
    refuse('pre_use_check_failed', 'preUseCheck', `bench ${b.code} failed its latest pre-use check on ${on}${b.latestCheck.notes ? `: ${b.latestCheck.notes}` : ''}`);
  }
  if (b.rcdType === null) warn('no_rcd', 'rcdType', 'No RCD fitted: not fit for live work');
  else if (b.rcdType === 'AC') warn('rcd_type_ac', 'rcdType', 'Type AC RCD — not suitable for phase-cut loads (they leak pulsating DC; Type A or better is needed)');
  if (b.rcdRatedResidualMa !== null && b.rcdRatedResidualMa > 30) {
    warn('rcd_above_30ma', 'rcdRatedResidualMa', `RCD rated ${b.rcdRatedResidualMa} mA: additional protection for live work needs 30 mA or less`);
  }
  if (!b.isolatingTransformer) warn('no_isolating_transformer', 'isolatingTransformer', 'No isolating transformer: the unit under test is not isolated from earth');
  if (!b.emergencyStop) warn('no_emergency_stop', 'emergencyStop', 'No emergency stop fitted');
  return f;
}

export interface InstrumentState {
  serial: string;
  kind: InstrumentKind;
  active: boolean;
  measurementCategory: string | null;
  voltageRating: number | null;
  trueRms: boolean;
  calibrationDueOn: string;
}

export function instrumentFlags(i: InstrumentState, at: Date, tz: string): EquipmentFlag[] {
  const f: EquipmentFlag[] = [];
  const refuse = (code: string, field: string, message: string) => f.push({ code, severity: 'refuse', field, message });
  const warn = (code: string, field: string, message: string) => f.push({ code, severity: 'warn', field, message });
  if (!i.active) refuse('out_of_service', 'active', `instrument SN ${i.serial} is out of service`);
  if (at >= endOfLocalDay(i.calibrationDueOn, tz)) refuse('calibration_expired', 'calibrationDueOn', `instrument SN ${i.serial} calibration expired on ${i.calibrationDueOn}`);
  else if (daysUntil(i.calibrationDueOn, at, tz) <= DUE_SOON_DAYS) warn('calibration_due', 'calibrationDueOn', `instrument SN ${i.serial} calibration is due on ${i.calibrationDueOn}`);
  if (i.measurementCategory === null) warn('no_category', 'measurementCategory', 'No measurement category: not for connection to mains circuits');
  if (!i.trueRms && RMS_READING_KINDS.includes(i.kind)) warn('not_true_rms', 'trueRms', 'Not true-RMS: reads phase-cut waveforms wrongly');
  return f;
}

/** Whether an instrument's rating covers a circuit of the given RMS voltage; null when it does. */
export function ratingProblem(i: InstrumentState, circuitVoltage: number): string | null {
  if (i.measurementCategory === null || i.voltageRating === null) {
    return `instrument SN ${i.serial} has no measurement category and must not be connected to a ${circuitVoltage} V circuit`;
  }
  if (circuitVoltage > i.voltageRating) {
    return `instrument SN ${i.serial} rated ${i.measurementCategory} ${i.voltageRating} V is not rated for a ${circuitVoltage} V circuit`;
  }
  return null;
}
