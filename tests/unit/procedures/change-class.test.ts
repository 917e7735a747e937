import { describe, it, expect } from 'vitest';
import { isAtLeast, minimumChangeClass } from '../../../shared/procedures/change-class.js';

const s = (key: string, holdPoint = false) => ({ key, holdPoint });

describe('minimum change class from the steps', () => {
  it('when only wording changes (same steps, same hold points), then editorial is enough', () => {
    expect(minimumChangeClass([s('a'), s('b', true), s('c')], [s('a'), s('b', true), s('c')])).toEqual({ minimum: 'editorial', reasons: [] });
  });

  it('when steps are added after the last hold point, then the hold point has not moved', () => {
    expect(minimumChangeClass([s('a'), s('b', true)], [s('a'), s('b', true), s('c'), s('d')]).minimum).toBe('editorial');
  });

  it('when a hold point is added, then re-assess, naming the step', () => {
    expect(minimumChangeClass([s('a'), s('b')], [s('a'), s('b', true)])).toEqual({ minimum: 're-assess', reasons: ['A hold point was added at step 2.'] });
  });

  it('when a step is inserted before a hold point, then the hold point counts as moved', () => {
    const r = minimumChangeClass([s('a'), s('b', true)], [s('a'), s('x'), s('b', true)]);
    expect(r.minimum).toBe('re-assess');
    expect(r.reasons).toEqual(['The hold point at step 3 (step 2 before) moved: different steps now come before it.']);
  });

  it('when two steps before a hold point swap places, then it has not moved (the same work comes before it)', () => {
    expect(minimumChangeClass([s('a'), s('b'), s('h', true)], [s('b'), s('a'), s('h', true)]).minimum).toBe('editorial');
  });

  it('when a hold point is dropped or its step deleted, then re-assess too (less witnessing is a change to the practical)', () => {
    expect(minimumChangeClass([s('a', true)], [s('a')]).reasons).toEqual(['Step 1 (step 1 before) is no longer a hold point.']);
    expect(minimumChangeClass([s('a'), s('b', true)], [s('a')]).reasons).toEqual(['The hold point at step 2 was removed together with its step.']);
  });

  it('ranks the classes editorial < re-read < re-assess', () => {
    expect(isAtLeast('re-read', 'editorial')).toBe(true);
    expect(isAtLeast('re-read', 're-assess')).toBe(false);
    expect(isAtLeast('re-assess', 're-assess')).toBe(true);
  });
});
