// First-order estimate of the RC + diac trigger: the capacitor voltage is treated as a steady sine.
import { bisect, radToDeg } from './numeric';

export interface TriggerNetwork {
  supplyVrms: number;
  frequencyHz: number;
  fixedResistanceOhms: number;
  potentiometerOhms: number;
  capacitanceF: number;
  breakoverV: number;
  /** Load in series with the network while the device is off (usually negligible). */
  loadOhms: number;
}

export interface TriggerEstimate {
  estimate: true;
  fires: boolean;
  /** Null where the capacitor peak stays below breakover. */
  firingAngleDeg: number | null;
  phaseLagDeg: number;
  capacitorPeakV: number;
  seriesResistanceOhms: number;
}

export interface FiringRange {
  estimate: true;
  /** Potentiometer at 0 (least resistance: earliest firing). */
  atMinimum: TriggerEstimate;
  atMaximum: TriggerEstimate;
  /** Settings at or above this never fire; null when the whole travel fires. */
  stopsFiringAtSetting: number | null;
  earliestDeg: number | null;
  latestDeg: number | null;
}

const seriesR = (n: TriggerNetwork, setting: number) =>
  n.fixedResistanceOhms + setting * n.potentiometerOhms + n.loadOhms;

export function estimateFiring(n: TriggerNetwork, setting: number): TriggerEstimate {
  const r = seriesR(n, setting);
  const wrc = 2 * Math.PI * n.frequencyHz * r * n.capacitanceF;
  const lag = Math.atan(wrc);
  const peak = (Math.SQRT2 * n.supplyVrms) / Math.sqrt(1 + wrc * wrc);
  const fires = peak >= n.breakoverV;
  // vc = peak·sin(θ − lag) reaches breakover at θ = lag + asin(V_BO / peak).
  const alpha = fires ? lag + Math.asin(n.breakoverV / peak) : null;
  return {
    estimate: true,
    fires,
    firingAngleDeg: alpha === null ? null : radToDeg(alpha),
    phaseLagDeg: radToDeg(lag),
    capacitorPeakV: peak,
    seriesResistanceOhms: r,
  };
}

/** Firing range across the whole potentiometer travel (the estimate rises monotonically with R). */
export function estimateFiringRange(n: TriggerNetwork): FiringRange {
  const atMinimum = estimateFiring(n, 0);
  const atMaximum = estimateFiring(n, 1);
  let stopsFiringAtSetting: number | null = null;
  if (!atMinimum.fires) stopsFiringAtSetting = 0;
  else if (!atMaximum.fires) {
    const margin = (s: number) => estimateFiring(n, s).capacitorPeakV - n.breakoverV;
    stopsFiringAtSetting = bisect(margin, 0, 1, 1e-9).x;
  }
  const latest = atMaximum.fires
    ? atMaximum.firingAngleDeg
    : stopsFiringAtSetting === 0
      ? null
      : estimateFiring(n, Math.max(0, (stopsFiringAtSetting ?? 1) - 1e-9)).firingAngleDeg;
  return {
    estimate: true,
    atMinimum,
    atMaximum,
    stopsFiringAtSetting,
    earliestDeg: atMinimum.firingAngleDeg,
    latestDeg: latest,
  };
}
