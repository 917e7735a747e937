// Time-domain simulation of the RC + diac trigger driving a triac into a resistive load.
import { radToDeg } from './numeric';
import type { TriggerNetwork } from './trigger';

export interface SimulationParams extends TriggerNetwork {
  setting: number;
  breakbackV: number;
  gateTriggerCurrentA: number;
  gateTriggerVoltageV: number;
  latchingCurrentA: number;
  holdingCurrentA: number;
  onStateVoltageV: number;
  /** Resistance the capacitor discharges through into the gate (diac dynamic + gate circuit). */
  gateCircuitOhms: number;
  cycles: number;
  stepsPerCycle: number;
  maxPoints: number;
  /** Samples are kept from this whole cycle on (0: from the start), so a plot can show the settled cycles. */
  recordFromCycle?: number;
}

export interface HalfCycleFiring {
  index: number;
  polarity: 'positive' | 'negative';
  firingAngleDeg: number | null;
}

export interface SimulationResult {
  samples: { t: number[]; supply: number[]; capacitor: number[]; output: number[] };
  halfCycles: HalfCycleFiring[];
  /** Mean of the last two half-cycles (positive and negative); null when either did not fire. */
  steadyStateFiringAngleDeg: number | null;
  method: string;
}

export function simulateTrigger(p: SimulationParams): SimulationResult {
  const w = 2 * Math.PI * p.frequencyHz;
  const vm = Math.SQRT2 * p.supplyVrms;
  const rNet = p.fixedResistanceOhms + p.setting * p.potentiometerOhms;
  const c = p.capacitanceF;
  const steps = Math.round(p.cycles * p.stepsPerCycle);
  const dt = 1 / (p.frequencyHz * p.stepsPerCycle);
  const firstRecorded = Math.round(Math.min(p.recordFromCycle ?? 0, p.cycles) * p.stepsPerCycle);
  const every = Math.max(1, Math.ceil((steps - firstRecorded + 1) / p.maxPoints));
  const diacOnV = p.breakoverV - p.breakbackV; // the diac falls back by breakback, not to zero
  const samples = { t: [] as number[], supply: [] as number[], capacitor: [] as number[], output: [] as number[] };
  const halfCycles: HalfCycleFiring[] = [];
  let vc = 0;
  let on = false;
  let onSign = 1;
  let diac = 0; // 0 off, ±1 conducting in that direction

  for (let k = 0; k <= steps; k += 1) {
    const t = k * dt;
    const theta = w * t;
    const half = Math.min(Math.floor(theta / Math.PI), 2 * p.cycles - 1);
    if (halfCycles.length <= half) {
      halfCycles.push({ index: half, polarity: half % 2 === 0 ? 'positive' : 'negative', firingAngleDeg: null });
    }
    const vs = vm * Math.sin(theta);
    let loadCurrent = 0;
    if (on) {
      loadCurrent = (vs - onSign * p.onStateVoltageV) / p.loadOhms;
      if (onSign * loadCurrent < p.holdingCurrentA) on = false; // current fell below holding
    }
    // While the device conducts it shorts the network, which relaxes towards the on-state voltage.
    const src = on ? onSign * p.onStateVoltageV : vs;
    const rSrc = on ? rNet : rNet + p.loadOhms;
    const vDiac = diac * (diacOnV + p.gateTriggerVoltageV);
    // Backward Euler for the capacitor node: stable when the gate discharge is much faster than dt.
    const g = c / dt + 1 / rSrc + (diac !== 0 ? 1 / p.gateCircuitOhms : 0);
    vc = (vc * (c / dt) + src / rSrc + (diac !== 0 ? vDiac / p.gateCircuitOhms : 0)) / g;
    let gateCurrent = diac !== 0 ? (vc - vDiac) / p.gateCircuitOhms : 0;
    if (diac !== 0 && diac * gateCurrent <= 0) {
      diac = 0; // the capacitor has dumped down to the diac's on-state voltage
      gateCurrent = 0;
    }
    if (diac === 0 && Math.abs(vc) >= p.breakoverV) {
      diac = Math.sign(vc);
      gateCurrent = (vc - diac * (diacOnV + p.gateTriggerVoltageV)) / p.gateCircuitOhms;
    }
    if (!on && Math.abs(gateCurrent) >= p.gateTriggerCurrentA) {
      const sign = Math.sign(vs) || 1;
      const candidate = (vs - sign * p.onStateVoltageV) / p.loadOhms;
      if (sign * candidate >= p.latchingCurrentA) {
        on = true;
        onSign = sign;
        loadCurrent = candidate;
        const cycle = halfCycles[half];
        if (cycle.firingAngleDeg === null) cycle.firingAngleDeg = radToDeg(theta - half * Math.PI);
      }
    }
    if (!on) loadCurrent = (vs - vc) / (rNet + p.loadOhms); // only the network current flows
    if (k >= firstRecorded && (k - firstRecorded) % every === 0 && samples.t.length < p.maxPoints) {
      samples.t.push(t);
      samples.supply.push(vs);
      samples.capacitor.push(vc);
      samples.output.push(loadCurrent * p.loadOhms);
    }
  }
  const last = halfCycles.slice(-2).map((h) => h.firingAngleDeg);
  const steady = last.length === 2 && last.every((a) => a !== null) ? ((last[0] as number) + (last[1] as number)) / 2 : null;
  return {
    samples,
    halfCycles,
    steadyStateFiringAngleDeg: steady,
    method: `fixed-step backward Euler, ${p.stepsPerCycle} steps per cycle over ${p.cycles} cycles`,
  };
}
