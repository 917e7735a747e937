// Inverse of the resistive case: the firing angle that delivers a target power.
import { EngineError } from './errors';
import { bisect, radToDeg } from './numeric';
import { powerFraction } from './resistive';

export type PowerTarget = { kind: 'power'; watts: number } | { kind: 'fraction'; value: number };

export interface InverseResult {
  alphaDeg: number;
  /** The solution lies within alphaDeg ± toleranceAchievedDeg. */
  toleranceAchievedDeg: number;
  powerFraction: number;
  outputPowerW: number;
  /** |achieved fraction − target fraction|. */
  fractionResidual: number;
  iterations: number;
  method: 'bisection';
}

export function firingAngleForPower(
  target: PowerTarget,
  fullPowerW: number,
  toleranceDeg = 1e-6,
): InverseResult {
  const field = target.kind === 'power' ? 'target.watts' : 'target.value';
  const fraction = target.kind === 'power' ? target.watts / fullPowerW : target.value;
  if (!(fraction >= 0 && fraction <= 1)) {
    const limit = target.kind === 'power' ? `0 to ${fullPowerW.toFixed(3)} W (full power)` : '0 to 1';
    throw new EngineError(field, `Target lies outside what phase control can deliver: ${limit}`);
  }
  // powerFraction falls monotonically on [0, π], so the root is bracketed and unique.
  const root = bisect((a) => powerFraction(a) - fraction, 0, Math.PI, (toleranceDeg * Math.PI) / 180);
  const achieved = powerFraction(root.x);
  return {
    alphaDeg: radToDeg(root.x),
    toleranceAchievedDeg: radToDeg(root.halfWidth),
    powerFraction: achieved,
    outputPowerW: achieved * fullPowerW,
    fractionResidual: Math.abs(achieved - fraction),
    iterations: root.iterations,
    method: 'bisection',
  };
}
