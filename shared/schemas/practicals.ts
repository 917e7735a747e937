import { z } from 'zod';
import './messages.js';
import { line, paragraph } from './text.js';
import { pageQuery, uuid } from './common.js';
import { OUTCOMES, PRACTICAL_STATUSES } from '../practicals/terms.js';

export {
  LOAD_KINDS, LOAD_KIND_LABELS, OUTCOMES, OUTCOME_LABELS, PRACTICAL_STATUSES, PRACTICAL_STATUS_LABELS, ASSESSED_MEANING, ACKNOWLEDGED_MEANING,
  type CircuitLoadKind, type Outcome, type PracticalStatus,
} from '../practicals/terms.js';

// The circuit under test on a practical. The supply is the bench's own; everything else the assessor enters.
const num = (what: string) => z.number({ message: `enter the ${what}` });
const ohms = (what: string) => num(what).positive(`the ${what} must be above zero`).max(1e7, `the ${what} is at most 10 MΩ`);
const watts = num('rated power').positive('the rated power must be above zero').max(1e5, 'at most 100 kW');
const ratedVolts = num('rated voltage').positive('the rated voltage must be above zero').max(1000, 'at most 1000 V');
const amps = (what: string) => num(what).positive(`the ${what} must be above zero`).max(1000, 'at most 1000 A');
const kPerW = (what: string) => num(what).min(0, `the ${what} cannot be negative`).max(1000);

export const circuitLoadSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('resistance'), ohms: ohms('load resistance') }),
  z.object({ kind: z.literal('rated'), ratedPowerW: watts, ratedVoltageV: ratedVolts }),
  z.object({ kind: z.literal('resistive-inductive'), resistanceOhms: ohms('load resistance'), inductanceH: num('inductance').min(0, 'the inductance cannot be negative').max(100) }),
  z.object({ kind: z.literal('lamp-filament'), ratedPowerW: watts, ratedVoltageV: ratedVolts }),
  z.object({ kind: z.literal('universal-motor'), ratedPowerW: watts, ratedVoltageV: ratedVolts }),
], { error: 'choose the kind of load' });

export const triggerNetworkSchema = z
  .object({
    fixedResistanceOhms: num('fixed resistance').min(0, 'cannot be negative').max(1e7),
    potentiometerOhms: num('potentiometer track resistance').min(0, 'cannot be negative').max(1e7),
    setting: num('potentiometer setting').min(0, 'between 0 and 1').max(1, 'between 0 and 1'),
    capacitanceF: num('timing capacitance').positive('the capacitance must be above zero').max(1e-3, 'at most 1 mF'),
    breakoverV: num('diac breakover voltage').positive('must be above zero').max(200),
    breakbackV: num('diac breakback voltage').min(0, 'cannot be negative').max(100),
    latchingCurrentA: amps('latching current'),
    holdingCurrentA: amps('holding current'),
    gateTriggerCurrentA: amps('gate trigger current'),
    gateTriggerVoltageV: num('gate trigger voltage').min(0).max(10, 'at most 10 V'),
  })
  .refine((t) => t.fixedResistanceOhms + t.potentiometerOhms > 0, { path: ['fixedResistanceOhms'], message: 'the trigger network needs some series resistance' })
  .refine((t) => t.breakbackV < t.breakoverV, { path: ['breakbackV'], message: 'the breakback must be smaller than the breakover voltage' });

export const deviceThermalSchema = z.object({
  thresholdVoltageV: num('threshold voltage V_T0').min(0).max(5, 'at most 5 V'),
  slopeResistanceOhms: num('slope resistance r_T').min(0).max(10, 'at most 10 Ω'),
  rthJunctionCaseKW: kPerW('junction-to-case thermal resistance'),
  rthCaseSinkKW: kPerW('case-to-sink thermal resistance'),
  rthSinkAmbientKW: kPerW('sink-to-ambient thermal resistance').optional(),
  ambientC: num('ambient temperature').min(-40).max(150),
  maxJunctionC: num('maximum junction temperature').min(0).max(250),
});

export const circuitSchema = z.object({
  load: circuitLoadSchema,
  trigger: triggerNetworkSchema,
  thermal: deviceThermalSchema.nullish().transform((v) => v ?? null),
});
export type Circuit = z.infer<typeof circuitSchema>;
export type CircuitInput = z.input<typeof circuitSchema>;

const id = (what: string) => uuid(`choose the ${what}`);

export const openPracticalBody = z.object({
  technicianId: id('technician'),
  benchId: id('bench'),
  procedureId: id('procedure'),
  versionId: id('procedure version'),
  checklistId: id('practical checklist').optional(),
  scopeId: id('authorisation scope').nullish().transform((v) => v ?? null),
  instrumentIds: z.array(id('instrument')).max(20, 'at most 20 instruments').default([]),
  circuit: circuitSchema,
  // Needed when the bench stands at another site than the technician's own.
  crossSiteReason: paragraph().max(1000, 'use at most 1000 characters').nullish().transform((v) => v?.trim() || null)
    .refine((v) => v === null || v.length >= 5, 'say why in a few words (at least 5 characters)'),
});
export type OpenPracticalBody = z.infer<typeof openPracticalBody>;

export const witnessBody = z.object({ note: paragraph().max(1000, 'use at most 1000 characters').nullish().transform((v) => v || null) });
export const outcomeBody = z.object({
  outcome: z.enum(OUTCOMES, { message: 'choose competent or not yet competent' }),
  comment: paragraph().min(3, 'say in a few words how it went').max(4000, 'use at most 4000 characters'),
  password: z.string().min(1, 're-enter your password to sign').max(1024),
});
export const acknowledgeBody = z.object({
  technician: line().min(1, "give the technician's e-mail").max(320),
  password: z.string().min(1, 'the technician re-enters their own password').max(1024),
});
export const correctionBody = z.object({ reason: paragraph().min(5, 'say what was wrong (at least 5 characters)').max(2000, 'use at most 2000 characters') });

export const practicalListQuery = pageQuery.extend({
  view: z.enum(['mine', 'site']).default('mine'),
  status: z.enum(PRACTICAL_STATUSES).optional(),
  outcome: z.enum(OUTCOMES).optional(),
  siteId: uuid().optional(),
  sort: z.enum(['heldAt', 'status']).default('heldAt'),
  dir: z.enum(['asc', 'desc']).default('desc'),
});
export type PracticalListQuery = z.infer<typeof practicalListQuery>;

export const candidatesQuery = z.object({ q: line().max(100).optional() });
export const holdPointParams = z.object({ id: uuid('id must be a UUID'), stepKey: uuid('stepKey must be a UUID') });
