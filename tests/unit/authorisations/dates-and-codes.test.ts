import { describe, it, expect } from 'vitest';
import { addMonths, daysLeft, lastDay, validityEnd } from '../../../server/authorisations/dates.js';
import { newVerificationCode, normaliseCode } from '../../../server/authorisations/codes.js';

describe('validity in calendar months at the site', () => {
  it('when a month is shorter, then the 31st becomes its last day (common practice for month-based expiry)', () => {
    expect(addMonths('2026-01-31', 1)).toBe('2026-02-28');
    expect(addMonths('2028-01-31', 1)).toBe('2028-02-29');
    expect(addMonths('2026-03-02', 12)).toBe('2027-03-02');
    expect(addMonths('2026-11-15', -12)).toBe('2025-11-15');
  });

  it('when issued in Leipzig, then 12 months run to the end of that local day (Europe/Berlin is UTC+1 in March)', () => {
    const end = validityEnd(new Date('2026-03-02T09:00:00Z'), 12, 'Europe/Berlin');
    expect(end.toISOString()).toBe('2027-03-02T23:00:00.000Z');
    expect(lastDay(end, 'Europe/Berlin')).toBe('2027-03-02');
  });

  it('when counted from a local morning, then the days left are whole calendar days to the last day', () => {
    expect(daysLeft(new Date('2027-03-02T23:00:00Z'), new Date('2027-01-20T09:00:00Z'), 'Europe/Berlin')).toBe(41);
    expect(daysLeft(new Date('2027-03-02T23:00:00Z'), new Date('2027-03-02T20:00:00Z'), 'Europe/Berlin')).toBe(0);
  });
});

describe('verification codes', () => {
  it('when made, then each is 32 base32 letters (160 random bits) and no two of many repeat', () => {
    const codes = new Set(Array.from({ length: 2000 }, newVerificationCode));
    expect(codes.size).toBe(2000);
    for (const c of [...codes].slice(0, 50)) expect(c).toMatch(/^[A-Z2-7]{32}$/);
    // Every letter of the alphabet turns up: the bits are spread over all 32 symbols.
    expect(new Set([...codes].join('')).size).toBe(32);
  });

  it('when typed from paper, then case, spaces and hyphens do not matter; anything else is not a code', () => {
    const c = newVerificationCode();
    expect(normaliseCode(c.toLowerCase().replace(/(.{4})/g, '$1 '))).toBe(c);
    expect(normaliseCode(`${c.slice(0, 16)}-${c.slice(16)}`)).toBe(c);
    expect(normaliseCode(c.slice(1))).toBeNull();
    expect(normaliseCode(c.replace(/.$/, '1'))).toBeNull();
  });
});
