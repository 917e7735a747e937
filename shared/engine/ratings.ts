// Protective ratings: fuse suggestion, device voltage rating, capacitor safety class, trigger resistor dissipation.
import { EngineError } from './errors';

/** Renard R10 (ISO 3): the series miniature fuse ratings (IEC 60127) are drawn from, e.g. 1.6 A, 3.15 A, 6.3 A. */
export const FUSE_SERIES = {
  R10: { name: 'Renard R10 (ISO 3), as used for IEC 60127 miniature fuse ratings', mantissas: [1, 1.25, 1.6, 2, 2.5, 3.15, 4, 5, 6.3, 8] },
  /** Common IEC 60269 gG ratings in amperes, from memory. */
  IEC60269: { name: 'Common IEC 60269 gG fuse ratings (from memory)', values: [2, 4, 6, 10, 16, 20, 25, 32, 40, 50, 63, 80, 100, 125] },
} as const;
export type FuseSeries = keyof typeof FUSE_SERIES;

/** Common practice, not a standard: rate the fuse at least 25 % above the running current. */
export const DEFAULT_FUSE_MARGIN = 1.25;
/** Common practice: V_DRM / V_RRM at least twice the supply peak, for mains transients. */
export const DEFAULT_VOLTAGE_MARGIN = 2;

/** The smallest value of the series at or above the required current. */
export function nextPreferredValue(required: number, series: FuseSeries = 'R10'): number {
  const entry = FUSE_SERIES[series];
  if ('values' in entry) {
    const value = entry.values.find((v) => v >= required);
    if (value === undefined) throw new RangeError(`No ${entry.name} value at or above ${required} A`);
    return value;
  }
  const mantissas = entry.mantissas;
  let decade = 10 ** Math.floor(Math.log10(required));
  for (let guard = 0; guard < 4; guard += 1, decade *= 10) {
    for (const m of mantissas) {
      const value = Number((m * decade).toPrecision(6)); // avoid 3.1500000000000004
      if (value >= required * (1 - 1e-12)) return value;
    }
  }
  throw new RangeError('nextPreferredValue: no value found');
}

export function suggestFuse(loadCurrentA: number, margin = DEFAULT_FUSE_MARGIN, series: FuseSeries = 'R10') {
  const requiredA = loadCurrentA * margin;
  const entry = FUSE_SERIES[series];
  if ('values' in entry && requiredA > entry.values[entry.values.length - 1]) {
    const largest = entry.values[entry.values.length - 1];
    throw new EngineError('loadCurrentA', `${requiredA.toFixed(1)} A (current × margin) is above the largest ${series} rating listed, ${largest} A`);
  }
  return { requiredA, ratingA: nextPreferredValue(requiredA, series), margin, series: FUSE_SERIES[series].name };
}

export function checkDeviceVoltage(supplyVrms: number, vdrmV: number, margin = DEFAULT_VOLTAGE_MARGIN) {
  const supplyPeakV = Math.SQRT2 * supplyVrms;
  const requiredV = supplyPeakV * margin;
  return { supplyPeakV, requiredV, ratedV: vdrmV, margin, ok: vdrmV >= requiredV };
}

export type CapacitorPosition = 'line-to-line' | 'line-to-earth';
export type CapacitorClass = 'X1' | 'X2' | 'X3' | 'Y1' | 'Y2' | 'Y3' | 'Y4' | 'none';

/** IEC 60384-14 subclasses, from memory: X across the line (failure is not a shock hazard), Y line to earth. */
export const CAPACITOR_CLASSES: Record<Exclude<CapacitorClass, 'none'>, string> = {
  X1: 'Across the line; peak impulse in service above 2.5 kV up to 4 kV (impulse test 4 kV).',
  X2: 'Across the line; peak impulse in service up to 2.5 kV (impulse test 2.5 kV): the usual choice on mains.',
  X3: 'Across the line; peak impulse in service up to 1.2 kV (no impulse test).',
  Y1: 'Line to earth, bridging double or reinforced insulation; up to 500 V AC (impulse test 8 kV).',
  Y2: 'Line to earth, bridging basic or supplementary insulation; 150 to 500 V AC (impulse test 5 kV).',
  Y3: 'Line to earth, basic or supplementary insulation; 150 to 250 V AC (no impulse test).',
  Y4: 'Line to earth, basic or supplementary insulation; below 150 V AC (impulse test 2.5 kV).',
};

export function checkCapacitorClass(position: CapacitorPosition, safetyClass: CapacitorClass, ratedVac: number, supplyVrms: number) {
  // A Y capacitor may stand in for an X capacitor; never the other way round.
  const classOk = position === 'line-to-line' ? safetyClass !== 'none' : safetyClass.startsWith('Y');
  const voltageOk = ratedVac >= supplyVrms;
  const needed = position === 'line-to-line' ? 'an X (or Y) class capacitor' : 'a Y class capacitor';
  return {
    ok: classOk && voltageOk,
    classOk,
    voltageOk,
    description: safetyClass === 'none' ? 'No safety class.' : CAPACITOR_CLASSES[safetyClass],
    note: `${position} use needs ${needed} per IEC 60384-14, rated at least ${supplyVrms} V AC.`,
  };
}

export interface TriggerResistorParams {
  supplyVrms: number;
  frequencyHz: number;
  fixedOhms: number;
  potOhms: number;
  setting: number;
  capacitanceF: number;
  fixedRatingW: number;
  potRatingW: number;
}

/** Worst case: the device never fires, so the RC branch sees the whole supply all cycle. */
export function triggerResistorDissipation(p: TriggerResistorParams) {
  const xc = 1 / (2 * Math.PI * p.frequencyHz * p.capacitanceF);
  const inUse = p.setting * p.potOhms;
  const current = (r: number) => p.supplyVrms / Math.hypot(r, xc);
  const iNow = current(p.fixedOhms + inUse);
  const fixedW = iNow * iNow * p.fixedOhms;
  const fixedWorstW = current(p.fixedOhms) ** 2 * p.fixedOhms; // pot at zero: most current
  const potW = iNow * iNow * inUse;
  // Common practice: a pot's rating applies to its whole track; derate to the fraction in use.
  const potAllowedW = p.potRatingW * p.setting;
  // Watts per unit of track in use is largest with the wiper near zero.
  const potWorstPerTrack = (p.supplyVrms ** 2 * p.potOhms) / (p.fixedOhms ** 2 + xc * xc);
  return {
    branchCurrentRmsA: iNow,
    fixed: { dissipationW: fixedW, worstCaseW: fixedWorstW, ratingW: p.fixedRatingW, ok: fixedWorstW <= p.fixedRatingW },
    potentiometer: { dissipationW: potW, allowedW: potAllowedW, ratingW: p.potRatingW, ok: potW <= potAllowedW || potW === 0, worstCaseOk: potWorstPerTrack <= p.potRatingW },
  };
}
