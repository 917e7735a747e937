// Ideal phase-cut waveforms for plotting: supply and output voltage, with the firing points.
import { extinctionAngle, loadAngle } from './inductive';
import { degToRad, radToDeg } from './numeric';
import type { HalfCycleFiring, SimulationResult } from './simulate';

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

export interface FiringPoint {
  t: number;
  angleDeg: number;
  supplyV: number;
}

/** What a plot needs: time from a supply zero crossing, supply and output voltage, the firing points. */
export interface WaveformSamples {
  t: number[];
  supply: number[];
  output: number[];
  firingPoints: FiringPoint[];
}

export interface IdealWaveform extends WaveformSamples {
  extinctionAngleDeg: number;
}

export interface SimulatedWaveform extends WaveformSamples {
  capacitor: number[];
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

/** The simulated samples from a whole cycle on, re-timed from that cycle's zero crossing, with each half-cycle's firing point. */
export function simulatedWaveform(
  samples: SimulationResult['samples'],
  halfCycles: HalfCycleFiring[],
  p: { supplyVrms: number; frequencyHz: number; fromCycle: number },
): SimulatedWaveform {
  const t0 = p.fromCycle / p.frequencyHz;
  const w = 2 * Math.PI * p.frequencyHz;
  const firingPoints: FiringPoint[] = [];
  for (const h of halfCycles) {
    const local = h.index - 2 * p.fromCycle;
    if (local < 0 || h.firingAngleDeg === null) continue;
    const theta = local * Math.PI + degToRad(h.firingAngleDeg);
    firingPoints.push({ t: theta / w, angleDeg: h.firingAngleDeg, supplyV: Math.SQRT2 * p.supplyVrms * Math.sin(theta) });
  }
  return { t: samples.t.map((t) => t - t0), supply: samples.supply, output: samples.output, capacitor: samples.capacitor, firingPoints };
}
