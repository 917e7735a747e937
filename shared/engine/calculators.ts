// One function per calculator mode: validated input in, JSON-serialisable result out (backs the POST routes).
import type {
  EarthContinuityInput, InductiveInput, InverseInput, LimitCheckInput, RatingsInput, ResistiveInput, ThermalInput, TriggerInput,
} from '../schemas/engine';
import { earthContinuityPreset } from './earth-continuity';
import { EngineError } from './errors';
import { inductivePhaseControl } from './inductive';
import { firingAngleForPower } from './inverse';
import { findPreset } from './limits';
import { evaluateAgainstPreset } from './limit-verdict';
import { coldFilamentInrushA, describeLoadModel } from './load-model';
import { degToRad } from './numeric';
import { checkCapacitorClass, checkDeviceVoltage, suggestFuse, triggerResistorDissipation } from './ratings';
import { loadResistance, resistivePhaseControl } from './resistive';
import { simulateTrigger } from './simulate';
import { thermalCheck } from './thermal';
import { estimateFiring, estimateFiringRange } from './trigger';
import { idealWaveform, simulatedWaveform } from './waveform';

const supplyOf = (s: { voltageRms: number; frequencyHz: number }) => ({ supplyVrms: s.voltageRms, frequencyHz: s.frequencyHz });

export function calculateResistive(input: ResistiveInput) {
  const r = loadResistance(input.load);
  const alphaRad = degToRad(input.alphaDeg);
  const supply = supplyOf(input.supply);
  return {
    loadResistanceOhms: r,
    ...resistivePhaseControl({ ...supply, resistanceOhms: r, alphaRad }),
    waveform: input.waveform ? idealWaveform({ ...supply, alphaRad, cycles: input.waveformCycles, points: input.samples }) : null,
    note: 'Ideal devices: on-state voltage drops and the bridge diodes are neglected.',
  };
}

export function calculateInverse(input: InverseInput) {
  const r = loadResistance(input.load);
  const fullPowerW = input.supply.voltageRms ** 2 / r;
  return { loadResistanceOhms: r, fullPowerW, ...firingAngleForPower(input.target, fullPowerW, input.toleranceDeg) };
}

export function calculateInductive(input: InductiveInput) {
  const loadModel = describeLoadModel(input.loadKind);
  const supply = supplyOf(input.supply);
  const alphaRad = degToRad(input.alphaDeg);
  // Back-EMF dominates a universal motor: an R-L figure would be confidently wrong, so none is given.
  if (input.loadKind === 'universal-motor') return { loadModel, figures: null, waveform: null, inrush: null };
  const params = { ...supply, resistanceOhms: input.resistanceOhms, inductanceH: input.inductanceH, alphaRad };
  return {
    loadModel,
    figures: inductivePhaseControl(params),
    waveform: input.waveform ? idealWaveform({ ...params, cycles: input.waveformCycles, points: input.samples }) : null,
    inrush: input.loadKind === 'lamp-filament' ? { estimate: true, ...coldFilamentInrushA(supply.supplyVrms, input.resistanceOhms) } : null,
  };
}

export function calculateTrigger(input: TriggerInput) {
  const supply = supplyOf(input.supply);
  const network = {
    ...supply,
    fixedResistanceOhms: input.fixedResistanceOhms,
    potentiometerOhms: input.potentiometerOhms,
    capacitanceF: input.capacitanceF,
    breakoverV: input.diac.breakoverV,
    loadOhms: input.loadOhms,
  };
  const recordFromCycle = Math.max(0, input.simulation.cycles - input.waveformCycles);
  const { samples, ...simulation } = simulateTrigger({
    ...network,
    ...input.device,
    ...input.simulation,
    maxPoints: input.samples,
    recordFromCycle,
    setting: input.setting,
    breakbackV: input.diac.breakbackV,
    gateCircuitOhms: input.gateCircuitOhms,
  });
  const expected = simulation.steadyStateFiringAngleDeg;
  // Power into the load at the simulated angle (ideal switch); none when the trigger never fires.
  const atAngle = resistivePhaseControl({ ...supply, resistanceOhms: input.loadOhms, alphaRad: degToRad(expected ?? 180) });
  return {
    /** The simulation is the authority for the expected firing angle. */
    expectedFiringAngleDeg: expected,
    firesInSteadyState: expected !== null,
    load: { outputVrms: atAngle.outputVrms, outputPowerW: atAngle.outputPowerW, powerFraction: atAngle.powerFraction, fullPowerW: atAngle.fullPowerW },
    estimate: estimateFiring(network, input.setting),
    range: estimateFiringRange(network),
    simulation,
    waveform: input.waveform ? simulatedWaveform(samples, simulation.halfCycles, { ...supply, fromCycle: recordFromCycle }) : null,
    note: 'The first-order estimate ignores the capacitor reset during conduction and usually fires later than the circuit does.',
  };
}

export const calculateThermal = (input: ThermalInput) => thermalCheck(input);

export function calculateRatings(input: RatingsInput) {
  const v = input.supply.voltageRms;
  return {
    fuse: suggestFuse(input.loadCurrentA, input.fuseMargin, input.fuseSeries),
    deviceVoltage: checkDeviceVoltage(v, input.vdrmV, input.voltageMargin),
    capacitor: input.capacitor ? checkCapacitorClass(input.capacitor.position, input.capacitor.safetyClass, input.capacitor.ratedVac, v) : null,
    triggerResistors: input.triggerResistors
      ? triggerResistorDissipation({ ...input.triggerResistors, supplyVrms: v, frequencyHz: input.supply.frequencyHz })
      : null,
  };
}

export function calculateLimitCheck(input: LimitCheckInput) {
  const preset = findPreset(input.presetId);
  if (!preset) throw new EngineError('presetId', `Unknown limit preset "${input.presetId}"`);
  return evaluateAgainstPreset(preset, input.measured);
}

export function calculateEarthContinuity(input: EarthContinuityInput) {
  const preset = earthContinuityPreset(input.lengthM, input.csaMm2, input.method);
  return { preset, verdict: input.measuredOhm === undefined ? null : evaluateAgainstPreset(preset, input.measuredOhm) };
}

export type ResistiveCalculation = ReturnType<typeof calculateResistive>;
export type InverseCalculation = ReturnType<typeof calculateInverse>;
export type InductiveCalculation = ReturnType<typeof calculateInductive>;
export type TriggerCalculation = ReturnType<typeof calculateTrigger>;
export type ThermalCalculation = ReturnType<typeof calculateThermal>;
export type RatingsCalculation = ReturnType<typeof calculateRatings>;
