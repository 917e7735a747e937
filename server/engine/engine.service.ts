// The calculator modes over HTTP: pure computation, so no repository; engine input errors become 422s naming the field.
import {
  COPPER_RESISTIVITY, EARTH_ALLOWANCE_OHM, EngineError, LEAD_RESISTANCE_MOHM_PER_M, LIMIT_PRESETS, calculateEarthContinuity,
  calculateInductive, calculateInverse, calculateLimitCheck, calculateRatings, calculateResistive, calculateThermal, calculateTrigger,
} from '../../shared/engine/index.js';
import { AppError } from '../errors.js';

/** Runs one calculation; an input the engine cannot work with is the caller's error, with the field it names. */
function run<I, O>(compute: (input: I) => O) {
  return (input: I): O => {
    try {
      return compute(input);
    } catch (e) {
      if (e instanceof EngineError) throw new AppError(422, 'engine_input', `${e.field}: ${e.message}`, { [e.field]: e.message });
      throw e;
    }
  };
}

export function makeEngineService() {
  return {
    resistive: run(calculateResistive),
    inverse: run(calculateInverse),
    inductive: run(calculateInductive),
    trigger: run(calculateTrigger),
    thermal: run(calculateThermal),
    ratings: run(calculateRatings),
    limitCheck: run(calculateLimitCheck),
    earthContinuity: run(calculateEarthContinuity),
    /** What checklist authors choose from, each limit with its source; earth continuity is computed per lead. */
    limitPresets: () => ({
      presets: LIMIT_PRESETS,
      earthContinuity: {
        allowanceOhm: EARTH_ALLOWANCE_OHM,
        leadMilliohmPerMetre: LEAD_RESISTANCE_MOHM_PER_M,
        copperResistivityOhmMm2PerM: COPPER_RESISTIVITY,
        note: 'The limit is the allowance plus the lead’s own protective-conductor resistance: ask for it with the lead’s length and cross-section.',
      },
    }),
  };
}
export type EngineService = ReturnType<typeof makeEngineService>;
