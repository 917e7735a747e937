import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { EngineError, calculateInverse, firingAngleForPower, powerFraction, degToRad } from '../../../shared/engine';

const supply = { voltageRms: 230, frequencyHz: 50 };

describe('firing angle for a target power', () => {
  it('finds 90° for half power (common practice) within the stated tolerance', () => {
    const r = firingAngleForPower({ kind: 'fraction', value: 0.5 }, 1000, 1e-6);
    expect(r.alphaDeg).toBeCloseTo(90, 5);
    expect(r.toleranceAchievedDeg).toBeLessThanOrEqual(1e-6);
    expect(Math.abs(r.alphaDeg - 90)).toBeLessThanOrEqual(r.toleranceAchievedDeg + 1e-9);
    expect(r.method).toBe('bisection');
  });

  it('solves a target in watts for a rated load (230 V, 1000 W heater at 250 W)', () => {
    const r = calculateInverse({ supply, load: { kind: 'rated', ratedPowerW: 1000, ratedVoltageV: 230 }, target: { kind: 'power', watts: 250 }, toleranceDeg: 1e-6 });
    expect(r.fullPowerW).toBeCloseTo(1000, 9);
    expect(r.outputPowerW).toBeCloseTo(250, 3);
  });

  it('round-trips: the power at the solved angle is the target (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 1, noNaN: true }), (target) => {
        const r = firingAngleForPower({ kind: 'fraction', value: target }, 500, 1e-7);
        return Math.abs(powerFraction(degToRad(r.alphaDeg)) - target) < 1e-6 && r.alphaDeg >= 0 && r.alphaDeg <= 180;
      }),
    );
  });

  it('throws an EngineError naming the field when the target exceeds full power', () => {
    const attempt = () =>
      calculateInverse({ supply, load: { kind: 'resistance', ohms: 52.9 }, target: { kind: 'power', watts: 1500 }, toleranceDeg: 1e-6 });
    expect(attempt).toThrow(EngineError);
    expect(attempt).toThrow(expect.objectContaining({ field: 'target.watts' }));
  });
});
