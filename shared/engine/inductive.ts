// Phase-angle control of a series R-L load: extinction angle from the standard transcendental equation.
import { EngineError } from './errors';
import { bisect, radToDeg, simpson } from './numeric';

export interface InductiveParams {
  supplyVrms: number;
  frequencyHz: number;
  resistanceOhms: number;
  inductanceH: number;
  alphaRad: number;
}

export interface InductiveResult {
  alphaDeg: number;
  loadAngleDeg: number;
  impedanceOhms: number;
  /** True when α ≤ φ: the current is a continuous sine and phase control has no effect. */
  fullConduction: boolean;
  extinctionAngleDeg: number;
  conductionAngleDeg: number;
  delayTimeS: number;
  outputVrms: number;
  loadCurrentRmsA: number;
  outputPowerW: number;
  powerFactor: number;
  perDirectionDevice: { averageA: number; rmsA: number };
  triac: { rmsA: number; meanAbsA: number };
  note: string;
}

/** Load angle φ = atan(ωL/R). */
export const loadAngle = (frequencyHz: number, r: number, l: number): number =>
  Math.atan2(2 * Math.PI * frequencyHz * l, r);

/** The residual of sin(β − φ) − sin(α − φ)·e^(−(β − α)/tan φ); zero at the extinction angle. */
export function extinctionResidual(beta: number, alpha: number, phi: number): number {
  const decay = phi > 0 ? Math.exp(-(beta - alpha) / Math.tan(phi)) : 0;
  return Math.sin(beta - phi) - Math.sin(alpha - phi) * decay;
}

/** Extinction angle β in (π, α + π) for α > φ; the first zero of the current after firing. */
export function extinctionAngle(alpha: number, phi: number, tolerance = 1e-12): number {
  if (alpha <= phi) return alpha + Math.PI; // continuous conduction
  if (phi === 0 || alpha >= Math.PI) return Math.max(alpha, Math.PI); // fired at the zero: no conduction
  // The current is positive just after α (di/dt ∝ sin α / sin φ), so scan for its first zero.
  const steps = 4096;
  const h = Math.PI / steps;
  let lo = alpha + h * 1e-3;
  // A near-zero load angle or α a hair below π: the current has already died within that first sliver.
  if (extinctionResidual(lo, alpha, phi) <= 0) return Math.max(lo, Math.PI);
  for (let i = 1; i <= steps; i += 1) {
    const hi = alpha + i * h;
    if (extinctionResidual(hi, alpha, phi) <= 0) return bisect((b) => extinctionResidual(b, alpha, phi), lo, hi, tolerance).x;
    lo = hi;
  }
  return alpha + Math.PI; // not reached for α in (φ, π]: the residual is negative at α + π
}

export function inductivePhaseControl(p: InductiveParams): InductiveResult {
  const { supplyVrms: v, frequencyHz: f, resistanceOhms: r, inductanceH: l, alphaRad: a } = p;
  if (!(a >= 0 && a <= Math.PI)) throw new EngineError('alphaDeg', 'Firing angle must lie between 0° and 180°');
  if (!(r > 0)) throw new EngineError('resistanceOhms', 'Resistance must be positive');
  const w = 2 * Math.PI * f;
  const z = Math.hypot(r, w * l);
  const phi = loadAngle(f, r, l);
  const vm = Math.SQRT2 * v;
  const full = a <= phi;
  const beta = extinctionAngle(a, phi);
  let outputVrms = v;
  let irms = v / z;
  let lobeIntegral = (2 * vm) / z; // ∫ over one half-cycle of a full sine current
  if (!full) {
    // ∫ sin²θ dθ from α to β, closed form; two lobes per cycle.
    const s2 = (beta - a) / 2 - (Math.sin(2 * beta) - Math.sin(2 * a)) / 4;
    outputVrms = vm * Math.sqrt(s2 / Math.PI);
    const current = (t: number) => (vm / z) * extinctionResidual(t, a, phi);
    irms = Math.sqrt(simpson((t) => current(t) ** 2, a, beta, 4000) / Math.PI);
    lobeIntegral = simpson(current, a, beta, 4000);
  }
  const power = irms * irms * r;
  return {
    alphaDeg: radToDeg(a),
    loadAngleDeg: radToDeg(phi),
    impedanceOhms: z,
    fullConduction: full,
    extinctionAngleDeg: radToDeg(full ? a + Math.PI : beta),
    conductionAngleDeg: radToDeg(full ? Math.PI : beta - a),
    delayTimeS: a / w,
    outputVrms,
    loadCurrentRmsA: irms,
    outputPowerW: power,
    powerFactor: irms > 0 ? power / (v * irms) : 0, // P/(V·I) = I·R/V, which tends to 0 as the current does
    perDirectionDevice: { averageA: lobeIntegral / (2 * Math.PI), rmsA: irms / Math.SQRT2 },
    triac: { rmsA: irms, meanAbsA: lobeIntegral / Math.PI },
    note: full
      ? 'Firing angle is at or below the load angle: the load sees the full sine (needs a gate signal that lasts until the current reverses).'
      : 'Current continues past the voltage zero until the extinction angle; device currents from numerical integration.',
  };
}
