import { describe, it, expect } from 'vitest';
import { endOfLocalDay, localDate, startOfLocalDay } from '../../../shared/time.js';

// Offsets from the IANA time zone database as shipped with Node's ICU; EU summer time starts on the
// last Sunday of March at 01:00 UTC (Directive 2000/84/EC), US on the second Sunday of March (from memory).
describe('site-local dates', () => {
  it('when a date-only expiry is in Berlin in winter, then it ends at 23:00 UTC that day', () => {
    expect(endOfLocalDay('2026-01-15', 'Europe/Berlin').toISOString()).toBe('2026-01-15T23:00:00.000Z');
  });

  it('when it is in Berlin in summer, then it ends at 22:00 UTC', () => {
    expect(endOfLocalDay('2026-07-15', 'Europe/Berlin').toISOString()).toBe('2026-07-15T22:00:00.000Z');
  });

  it('when the day is the one summer time starts (2026-03-29 in the EU), then the local day has 23 hours', () => {
    const start = startOfLocalDay('2026-03-29', 'Europe/Berlin');
    const end = endOfLocalDay('2026-03-29', 'Europe/Berlin');
    expect(start.toISOString()).toBe('2026-03-28T23:00:00.000Z');
    expect((end.getTime() - start.getTime()) / 3_600_000).toBe(23);
  });

  it('when it is in Ohio (America/New_York) in winter, then it ends at 05:00 UTC the next day', () => {
    expect(endOfLocalDay('2026-02-10', 'America/New_York').toISOString()).toBe('2026-02-11T05:00:00.000Z');
  });

  it('when the US clocks go forward (2026-03-08), then that local day has 23 hours', () => {
    const hours = (endOfLocalDay('2026-03-08', 'America/New_York').getTime() - startOfLocalDay('2026-03-08', 'America/New_York').getTime()) / 3_600_000;
    expect(hours).toBe(23);
  });

  it('when an instant is just before local midnight, then its local date is still that day', () => {
    expect(localDate(new Date('2026-01-15T22:59:59Z'), 'Europe/Berlin')).toBe('2026-01-15');
    expect(localDate(new Date('2026-01-15T23:00:00Z'), 'Europe/Berlin')).toBe('2026-01-16');
  });
});
