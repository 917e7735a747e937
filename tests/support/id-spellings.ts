/**
 * The spellings of one UUID that the API accepts (zod's uuid() takes any letter case; the shared id
 * schema lower-cases it) and those it refuses with 400 although PostgreSQL would read them.
 */
export function acceptedSpellings(id: string): string[] {
  const mixed = [...id].map((c, i) => (i % 2 ? c.toUpperCase() : c.toLowerCase())).join('');
  return [id.toLowerCase(), id.toUpperCase(), mixed];
}

export function refusedSpellings(id: string): string[] {
  const lower = id.toLowerCase();
  return [`{${lower}}`, lower.replace(/-/g, ''), `urn:uuid:${lower}`, ` ${lower}`];
}

/** One accepted spelling picked by a number (for property tests). */
export const spellingOf = (id: string, pick: number) => acceptedSpellings(id)[pick % 3];
