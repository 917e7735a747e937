import type { ScopeRow } from './scopes.repository.js';
import type { RequirementResult } from './requirements.js';
import type { PeriodRow } from './periods.repository.js';
import { addDays, earliest } from './dates.js';

/** Renewal opens this many days before expiry: the earliest reminder, or 30 days without reminders. */
export const windowDays = (scope: Pick<ScopeRow, 'reminderOffsetsDays'>) => (scope.reminderOffsetsDays.length ? Math.max(...scope.reminderOffsetsDays) : 30);
export const windowStart = (period: Pick<PeriodRow, 'endsAt'>, scope: Pick<ScopeRow, 'reminderOffsetsDays'>) => addDays(period.endsAt, -windowDays(scope));

/** Evidence that renews a period: recorded inside its renewal window, and after the period began (not what it was issued on). */
export const freshSince = (period: Pick<PeriodRow, 'endsAt' | 'startsAt'>, scope: Pick<ScopeRow, 'reminderOffsetsDays'>) => {
  const opens = windowStart(period, scope);
  const afterStart = new Date(period.startsAt.getTime() + 1);
  return opens > afterStart ? opens : afterStart;
};

const isPrior = (origin: string) => origin === 'prior' || origin === 'imported';

/**
 * What a period's end rests on. On a live-work scope a lapsed certificate suspends (after the grace
 * period) instead of ending it; a paper record rests only on the scopes it needs.
 */
export function capsFor(scope: ScopeRow, origin: string, results: RequirementResult[]): RequirementResult[] {
  return results.filter((r) => {
    if (!r.restsUntil) return false;
    if (scope.allowsLiveWork && r.kind === 'certificate') return false;
    return !isPrior(origin) || r.kind === 'prerequisite';
  });
}

/** The earliest of the validity and what the period rests on, never before the period began. */
export function plannedEnd(validityEndsAt: Date, caps: RequirementResult[], floor: Date): Date {
  const end = earliest(validityEndsAt, ...caps.map((c) => c.restsUntil));
  return end < floor ? floor : end;
}

/** Which basis sets an end: the validity, or the requirement that runs out first. */
export function whatSetsTheEnd(end: Date, validityEndsAt: Date, caps: RequirementResult[]): RequirementResult | null {
  if (end.getTime() >= validityEndsAt.getTime()) return null;
  return caps.find((c) => c.restsUntil && c.restsUntil.getTime() === end.getTime()) ?? null;
}

/** Fresh evidence: a requirement other than a prerequisite met by something recorded at or after `since`. */
export function isFresh(results: RequirementResult[], since: Date): boolean {
  return results.some((r) => r.kind !== 'prerequisite' && r.met && r.metSince !== null && r.metSince >= since);
}

export const allMet = (results: RequirementResult[]) => results.length > 0 && results.every((r) => r.met);
