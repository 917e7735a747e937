import type { SeedStep } from './index.js';
import { localDate } from '../../shared/time.js';
import { insertBench, type BenchInsert } from '../benches/benches.repository.js';
import { insertInstrument, type InstrumentInsert } from '../benches/instruments.repository.js';

type Bench = Omit<BenchInsert, 'siteId' | 'createdAt' | 'updatedAt' | 'nextInspectionOn' | 'active'> & { site: string; inspectionInDays: number };
type Instrument = Omit<InstrumentInsert, 'siteId' | 'createdAt' | 'updatedAt' | 'calibrationDueOn' | 'active'> & { site: string; calibrationInDays: number };

// Invented benches and instruments for the demo; due dates are counted from the day the demo is seeded.
const BENCHES: Bench[] = [
  { site: 'LEJ-W1', code: 'LEJ-B1', name: 'Dimmer repair bench', supplyVoltage: 230, supplyFrequency: 50, isolatingTransformer: true, isolatingTransformerVa: 1000, rcdType: 'A', rcdRatedResidualMa: 30, emergencyStop: true, inspectionInDays: 150, notes: 'Variac behind the isolating transformer; 30 mA Type A RCD ahead of the bench.' },
  { site: 'LEJ-W1', code: 'LEJ-B2', name: 'Motor controller bench', supplyVoltage: 230, supplyFrequency: 50, isolatingTransformer: true, isolatingTransformerVa: 630, rcdType: 'A', rcdRatedResidualMa: 30, emergencyStop: true, inspectionInDays: -30, notes: 'Periodic inspection overdue: booked with the electrician.' },
  { site: 'CLE-L2', code: 'CLE-B1', name: 'Heater regulator bench', supplyVoltage: 120, supplyFrequency: 60, isolatingTransformer: true, isolatingTransformerVa: 1500, rcdType: 'AC', rcdRatedResidualMa: 30, emergencyStop: true, inspectionInDays: 90, notes: 'Residual-current device is Type AC: replacement with Type A ordered.' },
  { site: 'CLE-L2', code: 'CLE-B2', name: 'Lamp dimmer test bench', supplyVoltage: 120, supplyFrequency: 60, isolatingTransformer: true, isolatingTransformerVa: 1000, rcdType: 'A', rcdRatedResidualMa: 30, emergencyStop: true, inspectionInDays: 200, notes: null },
];

const INSTRUMENTS: Instrument[] = [
  { site: 'LEJ-W1', kind: 'multimeter', make: 'Ohmwerk', model: 'DM 61', serial: 'OW61-20417', measurementCategory: 'CAT III', voltageRating: 600, trueRms: true, calibrationInDays: 240, notes: null },
  { site: 'LEJ-W1', kind: 'insulation_tester', make: 'Ohmwerk', model: 'IR 25', serial: 'OW25-00388', measurementCategory: 'CAT IV', voltageRating: 600, trueRms: false, calibrationInDays: 120, notes: '250 V / 500 V / 1000 V test voltages.' },
  { site: 'LEJ-W1', kind: 'rcd_tester', make: 'Trennfeld', model: 'RT 3', serial: 'TF3-11902', measurementCategory: 'CAT III', voltageRating: 300, trueRms: false, calibrationInDays: 20, notes: 'Tests Type AC and Type A (pulsating DC) devices.' },
  { site: 'LEJ-W1', kind: 'differential_probe', make: 'Brightline', model: 'DP 70', serial: 'BL70-5531', measurementCategory: 'CAT II', voltageRating: 1000, trueRms: false, calibrationInDays: 300, notes: 'For oscilloscope work on the phase-cut output without earthing the circuit.' },
  { site: 'CLE-L2', kind: 'multimeter', make: 'Brightline', model: 'M 12', serial: '12345', measurementCategory: 'CAT II', voltageRating: 300, trueRms: false, calibrationInDays: -16, notes: 'Calibration lapsed: do not use until it is back from the lab.' },
  { site: 'CLE-L2', kind: 'clamp_meter', make: 'Ohmwerk', model: 'CM 40', serial: 'OW40-77120', measurementCategory: 'CAT III', voltageRating: 600, trueRms: true, calibrationInDays: 180, notes: null },
];

export const seedBenches: SeedStep = async (tx, clock, audit, ctx) => {
  const now = clock.now();
  const inDays = (days: number) => localDate(new Date(now.getTime() + days * 86_400_000), 'UTC');
  for (const { site, inspectionInDays, ...b } of BENCHES) {
    const row = await insertBench(tx, { ...b, siteId: ctx.sites[site], nextInspectionOn: inDays(inspectionInDays), active: true, createdAt: now, updatedAt: now });
    await audit(tx, { actorId: null, action: 'seed.bench', entity: 'bench', entityId: row.id, newValues: { code: row.code } });
  }
  for (const { site, calibrationInDays, ...i } of INSTRUMENTS) {
    const row = await insertInstrument(tx, { ...i, siteId: ctx.sites[site], calibrationDueOn: inDays(calibrationInDays), active: true, createdAt: now, updatedAt: now });
    await audit(tx, { actorId: null, action: 'seed.instrument', entity: 'instrument', entityId: row.id, newValues: { serial: row.serial } });
  }
};
