// What the engine expects on the bench for a practical's circuit: computed once when the practical is
// opened and stored with it, so every measurement is judged against the same figures.
import { calculateTrigger } from '../engine/calculators.js';
import { inductivePhaseControl } from '../engine/inductive.js';
import { describeLoadModel, type LoadKind } from '../engine/load-model.js';
import { degToRad } from '../engine/numeric.js';
import { loadResistance, resistivePhaseControl } from '../engine/resistive.js';
import { thermalCheck } from '../engine/thermal.js';
import { triggerInputSchema } from '../schemas/engine.js';
import type { Circuit } from '../schemas/practicals.js';
import type { ComputedQuantity } from '../procedures/quantities.js';

export interface Supply {
  voltageRms: number;
  frequencyHz: number;
}

export interface Expectations {
  supply: Supply;
  load: { kind: Circuit['load']['kind']; modelled: boolean; note: string; resistanceOhms: number | null };
  /** From the time-domain simulation (the authority); the first-order estimate is shown as an estimate. */
  firing: { fires: boolean; angleDeg: number | null; estimateDeg: number | null } | null;
  quantities: Partial<Record<ComputedQuantity, number>>;
  thermal: { conductionLossW: number; junctionC: number | null; caseC: number | null; sinkC: number | null; withinLimit: boolean | null; statement: string } | null;
  notes: string[];
}

const ENGINE_KIND: Record<Circuit['load']['kind'], LoadKind> = {
  resistance: 'resistive', rated: 'resistive', 'resistive-inductive': 'resistive-inductive', 'lamp-filament': 'lamp-filament', 'universal-motor': 'universal-motor',
};

export const NO_MODEL_NOTE = 'No computed expectation: items whose rule needs one are judged by the assessor.';

export function computeExpectations(circuit: Circuit, supply: Supply): Expectations {
  const model = describeLoadModel(ENGINE_KIND[circuit.load.kind]);
  const base = { supply, thermal: null, quantities: {} };
  const load = circuit.load;
  if (!model.modelled || (load.kind !== 'resistance' && load.kind !== 'rated' && load.kind !== 'resistive-inductive')) {
    return { ...base, load: { kind: load.kind, modelled: false, note: model.note, resistanceOhms: null }, firing: null, notes: [model.note, NO_MODEL_NOTE] };
  }
  const r = load.kind === 'resistive-inductive' ? load.resistanceOhms : loadResistance(load);
  const t = circuit.trigger;
  const trigger = calculateTrigger(triggerInputSchema.parse({
    supply, loadOhms: r, fixedResistanceOhms: t.fixedResistanceOhms, potentiometerOhms: t.potentiometerOhms, setting: t.setting, capacitanceF: t.capacitanceF,
    diac: { breakoverV: t.breakoverV, breakbackV: t.breakbackV },
    device: { latchingCurrentA: t.latchingCurrentA, holdingCurrentA: t.holdingCurrentA, gateTriggerCurrentA: t.gateTriggerCurrentA, gateTriggerVoltageV: t.gateTriggerVoltageV },
  }));
  const alphaDeg = trigger.expectedFiringAngleDeg;
  const notes = [model.note];
  const loadView = { kind: load.kind, modelled: true, note: model.note, resistanceOhms: r };
  const firing = { fires: alphaDeg !== null, angleDeg: alphaDeg, estimateDeg: trigger.estimate.firingAngleDeg };
  if (alphaDeg === null) {
    notes.push('The trigger never fires at this setting: the load stays off.');
    return { ...base, load: loadView, firing, quantities: { 'output-rms-voltage': 0, 'load-rms-current': 0, 'load-power': 0 }, notes };
  }
  const p = { supplyVrms: supply.voltageRms, frequencyHz: supply.frequencyHz, resistanceOhms: r, alphaRad: degToRad(alphaDeg) };
  const figures = load.kind === 'resistive-inductive' ? inductivePhaseControl({ ...p, inductanceH: load.inductanceH }) : resistivePhaseControl(p);
  if (load.kind === 'resistive-inductive') notes.push('The firing angle is simulated with the trigger network driving a resistive load; the R-L figures follow from that angle.');
  const quantities: Expectations['quantities'] = {
    'firing-angle': alphaDeg,
    'conduction-angle': figures.conductionAngleDeg,
    'delay-time': figures.delayTimeS * 1000,
    'output-rms-voltage': figures.outputVrms,
    'load-rms-current': figures.loadCurrentRmsA,
    'load-power': figures.outputPowerW,
  };
  const thermal = thermalOf(circuit, figures.triac);
  // What a contact thermometer reads on the device tab and on the heatsink, when a heatsink value was given.
  if (thermal?.caseC != null) quantities['case-temperature'] = thermal.caseC;
  if (thermal?.sinkC != null) quantities['heatsink-temperature'] = thermal.sinkC;
  return { ...base, load: loadView, firing, quantities, thermal, notes };
}

function thermalOf(circuit: Circuit, triac: { rmsA: number; meanAbsA: number }): Expectations['thermal'] {
  if (!circuit.thermal) return null;
  const r = thermalCheck({ ...circuit.thermal, averageCurrentA: triac.meanAbsA, rmsCurrentA: triac.rmsA });
  return { conductionLossW: r.conductionLossW, junctionC: r.junctionC, caseC: r.caseC, sinkC: r.sinkC, withinLimit: r.withinLimit, statement: r.statement };
}
