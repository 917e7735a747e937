// Site-local calendar arithmetic with Intl only, so it runs the same in the browser and on the server.

// Building an Intl.DateTimeFormat costs far more than using one: each (kind, zone) is built once.
const formatters = new Map<string, Intl.DateTimeFormat>();
/** A cached formatter for a fixed set of options and one zone (the options must not vary per call under one kind). */
export function cachedFormat(kind: string, locale: string, options: Intl.DateTimeFormatOptions): Intl.DateTimeFormat {
  const key = `${kind}|${options.timeZone ?? ''}`;
  let f = formatters.get(key);
  if (!f) formatters.set(key, (f = new Intl.DateTimeFormat(locale, options)));
  return f;
}

/** Offset of `tz` from UTC at the instant `at`, in milliseconds (positive east of Greenwich). */
export function zoneOffsetMs(at: Date, tz: string): number {
  const parts = cachedFormat('offset', 'en-GB', {
    timeZone: tz, hourCycle: 'h23', year: 'numeric', month: '2-digit', day: '2-digit', hour: '2-digit', minute: '2-digit', second: '2-digit',
  }).formatToParts(at);
  const get = (t: string) => Number(parts.find((p) => p.type === t)?.value);
  const asUtc = Date.UTC(get('year'), get('month') - 1, get('day'), get('hour'), get('minute'), get('second'));
  return asUtc - Math.floor(at.getTime() / 1000) * 1000;
}

/** The UTC instant of local midnight starting the given calendar date (YYYY-MM-DD) in `tz`. */
export function startOfLocalDay(isoDate: string, tz: string): Date {
  const [y, m, d] = isoDate.split('-').map(Number);
  const guess = Date.UTC(y, m - 1, d);
  let t = guess - zoneOffsetMs(new Date(guess), tz);
  t = guess - zoneOffsetMs(new Date(t), tz); // second pass settles a DST change near midnight
  return new Date(t);
}

/** A date-only expiry ends at the end of that local day: the returned instant is the first moment after it. */
export function endOfLocalDay(isoDate: string, tz: string): Date {
  const [y, m, d] = isoDate.split('-').map(Number);
  const next = new Date(Date.UTC(y, m - 1, d + 1)).toISOString().slice(0, 10);
  return startOfLocalDay(next, tz);
}

/** The calendar date (YYYY-MM-DD) of an instant in `tz`. */
export function localDate(at: Date, tz: string): string {
  return cachedFormat('date', 'en-CA', { timeZone: tz, year: 'numeric', month: '2-digit', day: '2-digit' }).format(at);
}

export function isValidTimeZone(tz: string): boolean {
  try {
    new Intl.DateTimeFormat('en', { timeZone: tz });
    return true;
  } catch {
    return false;
  }
}

/** For display: date and time in the site's zone, with the zone's short name. */
export function formatInZone(at: Date | string, tz: string): string {
  return cachedFormat('stamp', 'en-GB', {
    timeZone: tz, year: 'numeric', month: 'short', day: '2-digit', hour: '2-digit', minute: '2-digit', timeZoneName: 'short',
  }).format(new Date(at));
}
