// Ideal phase-cut waveforms for plotting: supply and output voltage, with the firing points.
import { extinctionAngle, loadAngle } from './inductive';
import { radToDeg } from './numeric';

export interface IdealWaveformParams {
  supplyVrms: number;
  frequencyHz: number;
  alphaRad: number;
  /** Omit (or 0) for a resistive load. */
  resistanceOhms?: number;
  inductanceH?: number;
  cycles: number;
  points: number;
}

export interface IdealWaveform {
  t: number[];
  supply: number[];
  output: number[];
  firingPoints: { t: number; angleDeg: number; supplyV: number }[];
  extinctionAngleDeg: number;
}

export function idealWaveform(p: IdealWaveformParams): IdealWaveform {
  const w = 2 * Math.PI * p.frequencyHz;
  const vm = Math.SQRT2 * p.supplyVrms;
  const l = p.inductanceH ?? 0;
  const phi = l > 0 && p.resistanceOhms ? loadAngle(p.frequencyHz, p.resistanceOhms, l) : 0;
  const a = p.alphaRad;
  const full = a <= phi && l > 0;
  const beta = full ? a + Math.PI : extinctionAngle(a, phi);
  const span = p.cycles / p.frequencyHz;
  const out: IdealWaveform = { t: [], supply: [], output: [], firingPoints: [], extinctionAngleDeg: radToDeg(beta) };
  for (let i = 0; i < p.points; i += 1) {
    const t = (span * i) / (p.points - 1);
    const theta = w * t;
    const inHalf = theta % Math.PI; // angle measured from the latest zero crossing
    // Conducting from α to β after each zero crossing; β past π spills into the next half-cycle.
    const conducting = full || (inHalf >= a && inHalf <= beta) || inHalf <= beta - Math.PI;
    const vs = vm * Math.sin(theta);
    out.t.push(t);
    out.supply.push(vs);
    out.output.push(conducting && a < Math.PI ? vs : 0);
  }
  const halves = Math.round(2 * p.cycles);
  for (let k = 0; k < halves && a < Math.PI; k += 1) {
    const theta = k * Math.PI + a;
    out.firingPoints.push({ t: theta / w, angleDeg: radToDeg(a), supplyV: vm * Math.sin(theta) });
  }
  return out;
}
