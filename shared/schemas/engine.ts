// Input schemas for the phase-control engine: physical ranges, degrees at the boundary.
// z.number() in zod 4 refuses NaN and ±Infinity, so every number here is finite.
import { z } from 'zod';
import './messages.js';

const volts = z.number().positive().max(1000);
const ohms = z.number().positive().max(1e7);
const amps = z.number().positive().max(1000);
const angleDeg = z.number().min(0).max(180);
const kPerW = z.number().min(0).max(1000);

export const supplySchema = z.object({ voltageRms: volts, frequencyHz: z.number().min(40).max(70) });

export const resistiveLoadSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('resistance'), ohms }),
  z.object({ kind: z.literal('rated'), ratedPowerW: z.number().positive().max(1e6), ratedVoltageV: volts }),
]);

/** Waveform samples only on request, and bounded: one or two supply cycles, at most 4000 points. */
const waveformOptions = {
  waveform: z.boolean().default(false),
  samples: z.number().int().min(10).max(4000).default(400),
  waveformCycles: z.number().int().min(1).max(2).default(2),
};

export const resistiveInputSchema = z.object({ supply: supplySchema, load: resistiveLoadSchema, alphaDeg: angleDeg, ...waveformOptions });

export const inverseInputSchema = z.object({
  supply: supplySchema,
  load: resistiveLoadSchema,
  target: z.discriminatedUnion('kind', [
    z.object({ kind: z.literal('power'), watts: z.number().min(0).max(1e6) }),
    z.object({ kind: z.literal('fraction'), value: z.number().min(0).max(1) }),
  ]),
  toleranceDeg: z.number().min(1e-9).max(1).default(1e-6),
});

export const loadKindSchema = z.enum(['resistive', 'resistive-inductive', 'universal-motor', 'lamp-filament']);

export const inductiveInputSchema = z.object({
  supply: supplySchema,
  resistanceOhms: ohms,
  inductanceH: z.number().min(0).max(100),
  alphaDeg: angleDeg,
  loadKind: loadKindSchema.default('resistive-inductive'),
  ...waveformOptions,
});

export const triggerInputSchema = z
  .object({
    supply: supplySchema,
    loadOhms: ohms,
    fixedResistanceOhms: z.number().min(0).max(1e7),
    potentiometerOhms: z.number().min(0).max(1e7),
    setting: z.number().min(0).max(1),
    capacitanceF: z.number().positive().max(1e-3),
    diac: z.object({ breakoverV: z.number().positive().max(200), breakbackV: z.number().min(0).max(100) }),
    device: z.object({
      latchingCurrentA: amps,
      holdingCurrentA: amps,
      gateTriggerCurrentA: amps,
      gateTriggerVoltageV: z.number().min(0).max(10),
      onStateVoltageV: z.number().min(0).max(10).default(1.2),
    }),
    gateCircuitOhms: ohms.default(50),
    simulation: z
      .object({
        cycles: z.number().int().min(1).max(50).default(6),
        stepsPerCycle: z.number().int().min(200).max(20000).default(4000),
      })
      .prefault({}),
    ...waveformOptions,
  })
  // With no resistance the capacitor would sit straight across the supply: not a trigger network, and not solvable.
  .refine((v) => v.fixedResistanceOhms + v.setting * v.potentiometerOhms >= 1, {
    path: ['fixedResistanceOhms'],
    message: 'The trigger network needs at least 1 Ω of series resistance at this setting',
  })
  .refine((v) => v.diac.breakbackV < v.diac.breakoverV, {
    path: ['diac', 'breakbackV'],
    message: 'Breakback must be smaller than the breakover voltage',
  });

export const thermalInputSchema = z
  .object({
    thresholdVoltageV: z.number().min(0).max(5),
    slopeResistanceOhms: z.number().min(0).max(10),
    averageCurrentA: z.number().min(0).max(1000),
    rmsCurrentA: z.number().min(0).max(1000),
    rthJunctionCaseKW: kPerW,
    rthCaseSinkKW: kPerW,
    rthSinkAmbientKW: kPerW.optional(),
    ambientC: z.number().min(-40).max(150),
    maxJunctionC: z.number().min(0).max(250),
  })
  .refine((v) => v.rmsCurrentA >= v.averageCurrentA, {
    path: ['rmsCurrentA'],
    message: 'RMS current cannot be below the average current',
  });

export const ratingsInputSchema = z.object({
  supply: supplySchema,
  loadCurrentA: amps,
  fuseMargin: z.number().min(1).max(5).default(1.25),
  fuseSeries: z.enum(['R10', 'IEC60269']).default('R10'),
  vdrmV: z.number().positive().max(20000),
  voltageMargin: z.number().min(1).max(5).default(2),
  capacitor: z
    .object({
      position: z.enum(['line-to-line', 'line-to-earth']),
      safetyClass: z.enum(['X1', 'X2', 'X3', 'Y1', 'Y2', 'Y3', 'Y4', 'none']),
      ratedVac: volts,
    })
    .optional(),
  triggerResistors: z
    .object({
      fixedOhms: z.number().min(0).max(1e7),
      potOhms: z.number().min(0).max(1e7),
      setting: z.number().min(0).max(1),
      capacitanceF: z.number().positive().max(1e-3),
      fixedRatingW: z.number().positive().max(100),
      potRatingW: z.number().positive().max(100),
    })
    .optional(),
});

/** A reading in the preset's unit, or "did-not-trip" for an RCD or GFCI trip test. */
export const limitMeasurementSchema = z.union([z.number().min(0).max(1e9), z.literal('did-not-trip')], {
  error: 'Give a non-negative number in the preset\'s unit, or "did-not-trip"',
});

export const limitCheckInputSchema = z.object({ presetId: z.string().min(1).max(100), measured: limitMeasurementSchema });

export const earthContinuityInputSchema = z.object({
  lengthM: z.number().positive().max(100),
  csaMm2: z.number().positive().max(50),
  method: z.enum(['table', 'resistivity']).default('table'),
  measuredOhm: z.number().min(0).max(1e6).optional(),
});

export type ResistiveInput = z.infer<typeof resistiveInputSchema>;
export type InverseInput = z.infer<typeof inverseInputSchema>;
export type InductiveInput = z.infer<typeof inductiveInputSchema>;
export type TriggerInput = z.infer<typeof triggerInputSchema>;
export type ThermalInput = z.infer<typeof thermalInputSchema>;
export type RatingsInput = z.infer<typeof ratingsInputSchema>;
export type LimitCheckInput = z.infer<typeof limitCheckInputSchema>;
export type EarthContinuityInput = z.infer<typeof earthContinuityInputSchema>;
/** Request bodies before defaults are applied. */
export type TriggerRequest = z.input<typeof triggerInputSchema>;

export type {
  ResistiveCalculation as ResistiveOutput,
  InverseCalculation as InverseOutput,
  InductiveCalculation as InductiveOutput,
  TriggerCalculation as TriggerOutput,
  ThermalCalculation as ThermalOutput,
  RatingsCalculation as RatingsOutput,
} from '../engine/calculators';
