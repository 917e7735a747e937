// Phase-angle control of a resistive load (full-wave, symmetrical firing at α in each half-cycle).
import { EngineError } from './errors';
import { radToDeg } from './numeric';

export type ResistiveLoad =
  | { kind: 'resistance'; ohms: number }
  | { kind: 'rated'; ratedPowerW: number; ratedVoltageV: number };

export interface ResistiveParams {
  supplyVrms: number;
  frequencyHz: number;
  resistanceOhms: number;
  /** Firing angle after the supply zero crossing, radians, 0..π. */
  alphaRad: number;
}

export interface DeviceCurrents {
  averageA: number;
  rmsA: number;
}

export interface ResistiveResult {
  alphaDeg: number;
  conductionAngleDeg: number;
  delayTimeS: number;
  outputVrms: number;
  fullPowerW: number;
  outputPowerW: number;
  powerFraction: number;
  loadCurrentRmsA: number;
  powerFactor: number;
  /** One of two anti-parallel SCRs: conducts in one direction only. */
  perDirectionDevice: DeviceCurrents;
  /** Triac: its plain average over a cycle is zero, so the full-cycle mean of |i| is given. */
  triac: { rmsA: number; meanAbsA: number };
  /** One SCR inside a diode bridge: it carries the full-wave rectified current. */
  scrInBridge: { scr: DeviceCurrents; eachDiode: DeviceCurrents };
}

/** A lamp or heater given as rated power at rated voltage is treated as a fixed (hot) resistance. */
export function loadResistance(load: ResistiveLoad): number {
  const r = load.kind === 'resistance' ? load.ohms : load.ratedVoltageV ** 2 / load.ratedPowerW;
  if (!(r > 0) || !Number.isFinite(r)) throw new EngineError('load', 'Load resistance must be a positive number');
  return r;
}

/** Vout/V = sqrt(1 − α/π + sin2α/2π): also the power-fraction square root. */
export function outputRmsRatio(alphaRad: number): number {
  const s = 1 - alphaRad / Math.PI + Math.sin(2 * alphaRad) / (2 * Math.PI);
  return Math.sqrt(Math.max(0, s)); // rounding at α = π can give −1e-17
}

/** Fraction of full power delivered at α (monotonically falling from 1 at 0 to 0 at π). */
export const powerFraction = (alphaRad: number): number => outputRmsRatio(alphaRad) ** 2;

export function resistivePhaseControl(p: ResistiveParams): ResistiveResult {
  const { supplyVrms: v, frequencyHz: f, resistanceOhms: r, alphaRad: a } = p;
  if (!(a >= 0 && a <= Math.PI)) throw new EngineError('alphaDeg', 'Firing angle must lie between 0° and 180°');
  const ratio = outputRmsRatio(a);
  const outputVrms = v * ratio;
  const irms = outputVrms / r;
  // Mean of one half-cycle lobe over a whole cycle: (Vm / 2πR)(1 + cos α).
  const halfLobeAverage = ((Math.SQRT2 * v) / (2 * Math.PI * r)) * (1 + Math.cos(a));
  const perDirection = { averageA: halfLobeAverage, rmsA: irms / Math.SQRT2 };
  return {
    alphaDeg: radToDeg(a),
    conductionAngleDeg: radToDeg(Math.PI - a),
    delayTimeS: a / (2 * Math.PI * f),
    outputVrms,
    fullPowerW: (v * v) / r,
    outputPowerW: (outputVrms * outputVrms) / r,
    powerFraction: ratio * ratio,
    loadCurrentRmsA: irms,
    powerFactor: ratio, // P / (V·I) = Vout/V for a resistive load
    perDirectionDevice: perDirection,
    triac: { rmsA: irms, meanAbsA: 2 * halfLobeAverage },
    scrInBridge: {
      scr: { averageA: 2 * halfLobeAverage, rmsA: irms },
      eachDiode: perDirection,
    },
  };
}
