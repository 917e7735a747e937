import { cachedFormat, endOfLocalDay, localDate, startOfLocalDay } from '../../shared/time.js';

export const DAY_MS = 86_400_000;

/** Calendar months on a YYYY-MM-DD date; the 31st of a shorter month becomes its last day. */
export function addMonths(isoDate: string, months: number): string {
  const [y, m, d] = isoDate.split('-').map(Number);
  const first = new Date(Date.UTC(y, m - 1 + months, 1));
  const last = new Date(Date.UTC(first.getUTCFullYear(), first.getUTCMonth() + 1, 0)).getUTCDate();
  return new Date(Date.UTC(first.getUTCFullYear(), first.getUTCMonth(), Math.min(d, last))).toISOString().slice(0, 10);
}

/** A validity of whole months runs to the end of that local day at the holder's site. */
export function validityEnd(start: Date, months: number, tz: string): Date {
  return endOfLocalDay(addMonths(localDate(start, tz), months), tz);
}

/** The last local day something that ends at `endsAt` (exclusive) is good for. */
export function lastDay(endsAt: Date, tz: string): string {
  return localDate(new Date(endsAt.getTime() - 1), tz);
}

export function earliest(first: Date, ...rest: (Date | null | undefined)[]): Date {
  return rest.reduce<Date>((min, d) => (d && d.getTime() < min.getTime() ? d : min), first);
}

export const addDays = (at: Date, days: number) => new Date(at.getTime() + days * DAY_MS);

/** Whole local days from today to the last day something is good for ("lapses at the end of 2 Mar, in 41 days"). */
export function daysLeft(endsAt: Date, now: Date, tz: string): number {
  const diff = Date.parse(`${lastDay(endsAt, tz)}T00:00:00Z`) - Date.parse(`${localDate(now, tz)}T00:00:00Z`);
  return Math.max(0, Math.round(diff / DAY_MS));
}

export { endOfLocalDay, startOfLocalDay, localDate };

/** "2 Mar 2027" for e-mails and PDFs, read in the site's zone. */
export function formatDay(isoDate: string): string {
  const [y, m, d] = isoDate.split('-').map(Number);
  return cachedFormat('day', 'en-GB', { timeZone: 'UTC', day: 'numeric', month: 'short', year: 'numeric' }).format(new Date(Date.UTC(y, m - 1, d)));
}
