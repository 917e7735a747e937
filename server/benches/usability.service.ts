import type { Deps } from '../deps.js';
import type { Executor } from '../db/client.js';
import type { EquipmentFlag } from '../../shared/schemas/equipment-common.js';
import { ratingProblem } from '../../shared/equipment.js';
import { AppError, notFound } from '../errors.js';
import { findBench } from './benches.repository.js';
import { findInstrument } from './instruments.repository.js';
import { instrumentState, presentBench, presentInstrument } from './equipment.present.js';
import { typeAcDecisionsOf } from './type-ac.repository.js';
import { TYPE_AC_REFUSAL } from '../../shared/schemas/bench-decisions.js';

function refuse(status: number, code: string, problems: { field: string; message: string }[]): never {
  throw new AppError(status, code, problems.map((p) => p.message).join('; '), Object.fromEntries(problems.map((p) => [p.field, p.message])));
}

const warningsOf = (flags: EquipmentFlag[]) => flags.filter((f) => f.severity === 'warn');

/**
 * Whether a bench or an instrument may be used at a moment; a practical calls these when it is opened
 * (inside its own transaction, passing it as `db`). A refusal is an AppError naming each reason.
 */
export function makeUsability(deps: Deps) {
  /** Refuses (409) a bench that is out of service, past its inspection date, or whose latest pre-use check failed. */
  async function checkBenchUsable(benchId: string, at: Date, db: Executor = deps.db) {
    const view = await findBench(db, benchId);
    if (!view) throw notFound('That bench');
    const bench = presentBench(view, at);
    const refusals = bench.flags.filter((f) => f.severity === 'refuse');
    if (refusals.length) refuse(409, 'bench_not_usable', refusals);
    return { usable: true as const, bench, warnings: warningsOf(bench.flags) };
  }

  /**
   * Refuses (409) an instrument that is out of service or past its calibration date, and (422) one whose
   * measurement category and voltage rating do not cover a circuit of `circuitVoltage` volts RMS.
   */
  async function checkInstrumentUsable(instrumentId: string, at: Date, circuitVoltage?: number, db: Executor = deps.db) {
    const view = await findInstrument(db, instrumentId);
    if (!view) throw notFound('That instrument');
    const instrument = presentInstrument(view, at);
    const refusals = instrument.flags.filter((f) => f.severity === 'refuse');
    const rating = circuitVoltage === undefined ? null : ratingProblem(instrumentState(view), circuitVoltage);
    if (refusals.length) refuse(409, 'instrument_not_usable', rating ? [...refusals, { field: 'voltage', message: rating }] : refusals);
    if (rating) refuse(422, 'instrument_not_rated', [{ field: 'voltage', message: rating }]);
    return { usable: true as const, instrument, warnings: warningsOf(instrument.flags) };
  }

  /**
   * What a practical on a phase-cut load needs of a usable bench: a Type AC RCD only with a manager's
   * recorded decision (returned, to be kept on the practical), and a reason when the technician belongs
   * to another site than the bench. Refuses with 422 naming `benchId` or `crossSiteReason`.
   */
  async function checkBenchForPractical(bench: { id: string; code: string; siteId: string; rcdType: string | null }, technicianSiteId: string, crossSiteReason: string | null, db: Executor = deps.db) {
    if (bench.siteId !== technicianSiteId && !crossSiteReason) {
      refuse(422, 'cross_site_reason_needed', [{ field: 'crossSiteReason', message: `bench ${bench.code} is at another site than the technician's: say why they work there` }]);
    }
    if (bench.rcdType !== 'AC') return { typeAcDecision: null };
    const [decision] = await typeAcDecisionsOf(db, bench.id);
    if (!decision) refuse(422, 'bench_type_ac', [{ field: 'benchId', message: `bench ${bench.code} ${TYPE_AC_REFUSAL}` }]);
    return { typeAcDecision: decision };
  }

  return { checkBenchUsable, checkInstrumentUsable, checkBenchForPractical };
}

export type Usability = ReturnType<typeof makeUsability>;
