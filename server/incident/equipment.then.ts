import type { Executor } from '../db/client.js';
import { benchFlags, instrumentFlags } from '../../shared/equipment.js';
import type { RcdType } from '../../shared/schemas/benches.js';
import type { InstrumentKind } from '../../shared/schemas/instruments.js';
import { unprocessable } from '../errors.js';
import { findBench } from '../benches/benches.repository.js';
import { filesOf } from '../register/evidence.repository.js';
import { changesAfter, instrumentsFor, latestCheckBefore } from './incident.repository.js';
import { rewind } from './rewind.js';
import type { IncidentPack } from './incident.types.js';

const protection = (b: { isolatingTransformer: boolean; isolatingTransformerVa: number | null; rcdType: string | null; rcdRatedResidualMa: number | null; emergencyStop: boolean }) =>
  [b.isolatingTransformer ? `isolating transformer ${b.isolatingTransformerVa} VA` : 'no isolating transformer', b.rcdType ? `RCD Type ${b.rcdType} ${b.rcdRatedResidualMa} mA` : 'no RCD', b.emergencyStop ? 'emergency stop' : 'no emergency stop'].join(', ');

/** The bench as it was set up at the moment, with its latest pre-use check by then and the flags that stood. */
export async function benchThen(db: Executor, benchId: string, at: Date): Promise<NonNullable<IncidentPack['bench']>> {
  const view = await findBench(db, benchId);
  if (!view) throw unprocessable('benchId: no such bench', { benchId: 'no such bench' });
  const b = rewind(view.bench, await changesAfter(db, 'bench', [benchId], at));
  if (!b) throw unprocessable(`benchId: bench ${view.bench.code} was not yet recorded at that moment`, { benchId: 'not yet recorded at that moment' });
  const check = await latestCheckBefore(db, benchId, at);
  const files = check ? await filesOf(db, [{ type: 'bench_check', id: check.check.id }], at) : [];
  const latestCheck = check ? { at: check.check.at, passed: check.check.passed, notes: check.check.notes } : null;
  const flags = benchFlags({ ...b, rcdType: b.rcdType as RcdType | null, latestCheck }, at, view.timeZone).map((f) => f.message);
  return {
    siteId: b.siteId, timeZone: view.timeZone, code: b.code, name: b.name, siteCode: view.siteCode, supply: `${b.supplyVoltage} V ${b.supplyFrequency} Hz`,
    protection: protection(b), nextInspectionOn: b.nextInspectionOn, active: b.active, flags,
    latestCheck: check ? { ...latestCheck!, personName: check.personName, files } : null,
  };
}

/** Instruments at the bench's site and those used in the practicals, with their calibration as it stood. */
export async function instrumentsThen(db: Executor, siteId: string | null, ids: string[], at: Date, tz: string): Promise<IncidentPack['instruments']> {
  const rows = await instrumentsFor(db, siteId, ids);
  const changes = await changesAfter(db, 'instrument', rows.map((r) => r.id), at);
  const out: IncidentPack['instruments'] = [];
  for (const row of rows) {
    const i = rewind(row, changes.filter((c) => c.entityId === row.id));
    if (!i) continue;
    const flags = instrumentFlags({ ...i, kind: i.kind as InstrumentKind }, at, tz).map((f) => f.message);
    out.push({ kind: i.kind, make: i.make, model: i.model, serial: i.serial, rating: i.measurementCategory ? `${i.measurementCategory} ${i.voltageRating} V` : 'no category', calibrationDueOn: i.calibrationDueOn, flags });
  }
  return out;
}
