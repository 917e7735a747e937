// Calendar arithmetic on plain YYYY-MM-DD dates (no time zone involved once the local date is known).

const pad = (n: number) => String(n).padStart(2, '0');
const fmt = (d: Date) => `${d.getUTCFullYear()}-${pad(d.getUTCMonth() + 1)}-${pad(d.getUTCDate())}`;

export function addDays(isoDate: string, days: number): string {
  const [y, m, d] = isoDate.split('-').map(Number);
  return fmt(new Date(Date.UTC(y, m - 1, d + days)));
}

/** Months later on the same day of the month, or the month's last day when it has no such day (31 Jan + 1 → 28/29 Feb). */
export function addMonths(isoDate: string, months: number): string {
  const [y, m, d] = isoDate.split('-').map(Number);
  const lastDay = new Date(Date.UTC(y, m - 1 + months + 1, 0)).getUTCDate();
  return fmt(new Date(Date.UTC(y, m - 1 + months, Math.min(d, lastDay))));
}
