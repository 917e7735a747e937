// The explicit checks behind a refused password: a common one dressed up, or the person's own name.
// Pure string work over a word set handed in, so the client can run it too.

/** Lower case, compatibility forms merged (NFKC), accents removed: "Amélie" and "AMELIE" compare equal. */
export function fold(text: string): string {
  return text.normalize('NFKC').toLowerCase().normalize('NFD').replace(/\p{M}/gu, '').normalize('NFC');
}

// Look-alike substitutions people use to "strengthen" a word. 1 can stand for i or l, so both are tried.
const LEET: Record<string, string> = { '0': 'o', '3': 'e', '4': 'a', '5': 's', '7': 't', '8': 'b', '9': 'g', '@': 'a', $: 's', '!': 'i', '+': 't', '|': 'l', '(': 'c', '€': 'e' };
function unleet(text: string, digitsToo = true): string[] {
  const base = [...text].map((c) => (digitsToo || !/\d/.test(c) ? (LEET[c] ?? c) : c)).join('');
  return digitsToo && base.includes('1') ? [base.replaceAll('1', 'i'), base.replaceAll('1', 'l')] : [base];
}

// Digits, years, punctuation and spaces added before or after a word.
const strip = (text: string) => text.replace(/^[\p{N}\p{P}\p{S}\s]+|[\p{N}\p{P}\p{S}\s]+$/gu, '');

/**
 * The forms a password may be hiding a word in: as typed, decorations stripped, look-alikes undone
 * before or after stripping ("p@ssw0rd1234567" → password), or only the symbol ones ("$uperman2024").
 */
export function variants(folded: string): string[] {
  const out = new Set([folded, strip(folded)]);
  for (const form of [...out]) {
    for (const v of [...unleet(form), ...unleet(form, false)]) out.add(v).add(strip(v));
  }
  out.delete('');
  return [...out];
}

/** "passwordpassword", "aaaaaaaaaaaaaaa", "123412341234123": a short unit, or a common word, repeated. */
export function isRepeatOf(pw: string, common: Set<string>): boolean {
  for (let len = 1; len <= pw.length / 2; len++) {
    if (pw.length % len) continue;
    const unit = pw.slice(0, len);
    if (unit.repeat(pw.length / len) === pw && (len <= 4 || common.has(unit))) return true;
  }
  return false;
}

/** "1234567890123456", "abcdefghijklmnop", "9876543210987654": one step up or down all the way. */
export function isSequence(pw: string): boolean {
  const step = (a: string, b: string) => {
    if (/\d/.test(a) && /\d/.test(b)) return (Number(b) - Number(a) + 10) % 10;
    return b.charCodeAt(0) - a.charCodeAt(0);
  };
  const first = step(pw[0], pw[1]);
  if (![1, -1, 9].includes(first)) return false;
  for (let i = 2; i < pw.length; i++) if (step(pw[i - 1], pw[i]) !== first) return false;
  return true;
}

/** Is the password, or its base once digits, years, symbols and look-alikes are taken off, a common one? */
export function isCommon(folded: string, common: Set<string>): 'exact' | 'variant' | null {
  if (common.has(folded) || isRepeatOf(folded, common) || isSequence(folded)) return 'exact';
  for (const v of variants(folded)) if (common.has(v) || isRepeatOf(v, common)) return 'variant';
  return null;
}

/**
 * The parts of the person's name and e-mail local part worth looking for: "Amélie Fournier",
 * "amelie.f84" → amelie, fournier. Parts of 4 letters or more are looked for anywhere; 3-letter parts
 * ("Eve", "Tom") only as a word of their own, so "seven" or "bottom" stay allowed.
 */
export function personalWords(context: string[]): { anywhere: string[]; asWord: string[] } {
  const parts = new Set(['breakover']);
  for (const c of context) for (const p of fold(c).split(/[^\p{L}]+/u)) if (p.length >= 3) parts.add(p);
  const all = [...parts];
  return { anywhere: all.filter((p) => p.length >= 4), asWord: all.filter((p) => p.length === 3) };
}

export function containsPersonal(folded: string, context: string[]): boolean {
  const { anywhere, asWord } = personalWords(context);
  for (const v of new Set([folded, ...unleet(folded)])) {
    if (anywhere.some((w) => v.includes(w))) return true;
    const words = v.split(/[^\p{L}]+/u);
    if (asWord.some((w) => words.includes(w))) return true;
  }
  return false;
}
