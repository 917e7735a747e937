// Small numerical helpers shared by the engine (no dependencies, runs in the browser).

export const degToRad = (deg: number): number => (deg * Math.PI) / 180;
export const radToDeg = (rad: number): number => (rad * 180) / Math.PI;

export interface RootResult {
  x: number;
  /** Half-width of the final bracket: the root lies within x ± halfWidth. */
  halfWidth: number;
  iterations: number;
}

/** Bisection on [lo, hi]; f(lo) and f(hi) must have opposite signs (or one be zero). */
export function bisect(
  f: (x: number) => number,
  lo: number,
  hi: number,
  tolerance = 1e-12,
  maxIterations = 200,
): RootResult {
  let fLo = f(lo);
  const fHi = f(hi);
  if (fLo === 0) return { x: lo, halfWidth: 0, iterations: 0 };
  if (fHi === 0) return { x: hi, halfWidth: 0, iterations: 0 };
  if (Math.sign(fLo) === Math.sign(fHi)) throw new RangeError('bisect: root is not bracketed');
  let a = lo;
  let b = hi;
  let iterations = 0;
  while ((b - a) / 2 > tolerance && iterations < maxIterations) {
    const m = (a + b) / 2;
    const fm = f(m);
    iterations += 1;
    if (fm === 0) return { x: m, halfWidth: 0, iterations };
    if (Math.sign(fm) === Math.sign(fLo)) {
      a = m;
      fLo = fm;
    } else {
      b = m;
    }
  }
  return { x: (a + b) / 2, halfWidth: (b - a) / 2, iterations };
}

/** Composite Simpson's rule with n (made even) intervals. */
export function simpson(f: (x: number) => number, a: number, b: number, n = 2000): number {
  const intervals = n % 2 === 0 ? n : n + 1;
  if (b === a) return 0;
  const h = (b - a) / intervals;
  let sum = f(a) + f(b);
  for (let i = 1; i < intervals; i += 1) sum += f(a + i * h) * (i % 2 === 0 ? 2 : 4);
  return (sum * h) / 3;
}

/** Replace non-finite numbers by null so results stay JSON-serialisable. */
export const finiteOrNull = (x: number): number | null => (Number.isFinite(x) ? x : null);
