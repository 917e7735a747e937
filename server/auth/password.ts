import { createHash } from 'node:crypto';
import bcrypt from 'bcryptjs';
import { passwordVerdict } from '../../shared/password-verdict.js';

// Cost 12 in service; the test run lowers it through BCRYPT_COST to keep the suite quick.
const COST = Math.max(4, Number(process.env.BCRYPT_COST ?? 12));

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

/**
 * Returns why a new password is refused, or null: length, a common password (also with digits, a year or
 * look-alike symbols added), the person's name or e-mail (`context`), then a strength estimate. The rules
 * live in shared/ so the client can show the same verdict while typing; this is the one that decides.
 */
export function passwordProblem(password: string, context: string[] = []): string | null {
  return passwordVerdict(password, context);
}
