import { createHash } from 'node:crypto';
import bcrypt from 'bcryptjs';
import { dictionary } from '@zxcvbn-ts/language-common';
import { PASSWORD_MIN, PASSWORD_MAX } from '../../shared/password-rules.js';

// Cost 12 in service; the test run lowers it through BCRYPT_COST to keep the suite quick.
const COST = Math.max(4, Number(process.env.BCRYPT_COST ?? 12));
let common: Set<string> | null = null;

/** NFKC first (NIST SP 800-63B rev. 4 asks for normalisation), so the same password always hashes the same. */
function normalise(password: string): string {
  return password.normalize('NFKC');
}

// bcrypt reads only the first 72 bytes. Pre-hashing with SHA-256 (base64, 44 bytes, no NUL) makes every
// character of a long password count instead of silently dropping the tail.
function prehash(password: string): string {
  return createHash('sha256').update(normalise(password), 'utf8').digest('base64');
}

export async function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(prehash(password), COST);
}

export async function verifyPassword(password: string, hash: string | null): Promise<boolean> {
  // Compare against a fixed hash when there is none, so unknown accounts take as long as known ones.
  return bcrypt.compare(prehash(password), hash ?? DUMMY_HASH);
}

const DUMMY_HASH = '$2b$12$BkfPOKBbTUOgd12AK/eoA.ZDr6hgtcsn05hYa.yE..jfmVBVt6bC.';

/** Returns why a new password is refused, or null. Length, the bundled common list, and context words. */
export function passwordProblem(password: string, context: string[] = []): string | null {
  const pw = normalise(password);
  const chars = [...pw].length;
  if (chars < PASSWORD_MIN) return `use at least ${PASSWORD_MIN} characters`;
  if (chars > PASSWORD_MAX) return `use at most ${PASSWORD_MAX} characters`;
  const lower = pw.toLowerCase();
  common ??= new Set(dictionary['passwords-common'].map((w) => w.toLowerCase()));
  if (common.has(lower) || isRepeatOfCommon(lower, common) || isSequence(lower)) return 'this password is too common; choose another';
  for (const word of ['breakover', ...context.map((c) => c.toLowerCase()).filter((c) => c.length >= 4)]) {
    if (lower.includes(word)) return 'do not use your name, e-mail or the name of this service in the password';
  }
  return null;
}

// "passwordpassword", "aaaaaaaaaaaaaaa", "123412341234123": a short or common unit repeated.
function isRepeatOfCommon(pw: string, list: Set<string>): boolean {
  for (let len = 1; len <= pw.length / 2; len++) {
    if (pw.length % len) continue;
    const unit = pw.slice(0, len);
    if (unit.repeat(pw.length / len) === pw && (len <= 4 || list.has(unit))) return true;
  }
  return false;
}

// "1234567890123456", "abcdefghijklmnop", "9876543210987654": one step up or down the keyboard row.
function isSequence(pw: string): boolean {
  const step = (a: string, b: string) => {
    if (/\d/.test(a) && /\d/.test(b)) return (Number(b) - Number(a) + 10) % 10;
    return b.charCodeAt(0) - a.charCodeAt(0);
  };
  const first = step(pw[0], pw[1]);
  if (![1, -1, 9].includes(first)) return false;
  for (let i = 2; i < pw.length; i++) if (step(pw[i - 1], pw[i]) !== first) return false;
  return true;
}
