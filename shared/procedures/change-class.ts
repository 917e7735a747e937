// The lowest change class a new version may state, found by comparing its steps with the version it
// was drafted from. A hold point counts as moved when the steps before it are no longer the same steps.
import type { ChangeClass } from '../schemas/procedures.js';

export interface StepLike {
  key: string;
  holdPoint: boolean;
}

const RANK: Record<ChangeClass, number> = { editorial: 0, 're-read': 1, 're-assess': 2 };

export const isAtLeast = (given: ChangeClass, minimum: ChangeClass) => RANK[given] >= RANK[minimum];

function before(steps: readonly StepLike[], index: number): string {
  return steps.slice(0, index).map((s) => s.key).sort().join(',');
}

/** Plain sentences naming each hold point that was added, removed or moved. */
export function holdPointChanges(prev: readonly StepLike[], next: readonly StepLike[]): string[] {
  const reasons: string[] = [];
  const prevAt = new Map(prev.map((s, i) => [s.key, i]));
  const nextAt = new Map(next.map((s, i) => [s.key, i]));
  next.forEach((s, i) => {
    if (!s.holdPoint) return;
    const was = prevAt.get(s.key);
    if (was === undefined || !prev[was].holdPoint) reasons.push(`A hold point was added at step ${i + 1}.`);
    else if (before(prev, was) !== before(next, i)) reasons.push(`The hold point at step ${i + 1} (step ${was + 1} before) moved: different steps now come before it.`);
  });
  prev.forEach((s, i) => {
    if (!s.holdPoint) return;
    const now = nextAt.get(s.key);
    if (now === undefined) reasons.push(`The hold point at step ${i + 1} was removed together with its step.`);
    else if (!next[now].holdPoint) reasons.push(`Step ${now + 1} (step ${i + 1} before) is no longer a hold point.`);
  });
  return reasons;
}

export interface ChangeCheck {
  minimum: ChangeClass;
  reasons: string[];
}

export function minimumChangeClass(prev: readonly StepLike[], next: readonly StepLike[]): ChangeCheck {
  const reasons = holdPointChanges(prev, next);
  return { minimum: reasons.length ? 're-assess' : 'editorial', reasons };
}
