import type { Deps } from '../deps.js';
import { AppError } from '../errors.js';
import { findUserById, updateUser, type UserRow } from '../people/people.repository.js';
import { verifyPassword } from './password.js';

export type PasswordUse = 'sign-in' | 'signature' | 'password-change';
export type PasswordVerdict = { result: 'right' } | { result: 'wrong' } | { result: 'locked'; minutes: number };

/** The one answer for a locked account, wherever a password was given; `field` puts it beside that input. */
export function lockedError(minutes: number, field?: string): AppError {
  const reason = `this account is locked for ${minutes} more minute(s) after too many wrong passwords`;
  if (!field) return new AppError(401, 'locked', `T${reason.slice(1)}.`);
  return new AppError(401, 'locked', `${field}: ${reason}`, { [field]: reason });
}

/**
 * The one password check for sign-in, signatures and password changes: a locked account is refused even
 * with the right password, and every wrong one adds to the same count (config.signIn.lockoutThreshold).
 * The count is written in its own transaction on the pool, so it stays when the caller's change does not
 * happen (and is never rolled back with it).
 */
export function makePasswordCheck({ db, clock, config, audit }: Deps) {
  const minutesUntil = (until: Date, now: Date) => Math.max(1, Math.ceil((until.getTime() - now.getTime()) / 60_000));

  async function check(user: UserRow | undefined, password: string, use: PasswordUse): Promise<PasswordVerdict> {
    // Always compare, so an unknown account takes as long to refuse as a known one.
    const ok = await verifyPassword(password, user?.passwordHash ?? null);
    if (!user || !user.passwordHash) return { result: 'wrong' };
    const now = clock.now();
    if (user.lockedUntil && user.lockedUntil > now) return { result: 'locked', minutes: minutesUntil(user.lockedUntil, now) };
    if (ok) {
      if (user.failedSignIns > 0 || user.lockedUntil) await updateUser(db, user.id, { failedSignIns: 0, lockedUntil: null });
      return { result: 'right' };
    }
    const lockedUntil = await countFailure(user.id, now, use);
    return lockedUntil ? { result: 'locked', minutes: minutesUntil(lockedUntil, now) } : { result: 'wrong' };
  }

  /** One more wrong password; at the threshold the account locks and the count starts again. */
  async function countFailure(userId: string, now: Date, use: PasswordUse): Promise<Date | null> {
    return db.transaction(async (tx) => {
      const fresh = await findUserById(tx, userId, true);
      if (!fresh) return null;
      // Another request locked it meanwhile: that lock stands as it is.
      if (fresh.lockedUntil && fresh.lockedUntil > now) return fresh.lockedUntil;
      const failed = fresh.failedSignIns + 1;
      if (failed < config.signIn.lockoutThreshold) {
        await updateUser(tx, userId, { failedSignIns: failed });
        return null;
      }
      const lockedUntil = new Date(now.getTime() + config.signIn.lockoutMs);
      await updateUser(tx, userId, { failedSignIns: 0, lockedUntil });
      await audit(tx, { actorId: null, action: 'account.locked', entity: 'user', entityId: userId, newValues: { failedSignIns: failed, lockedUntil, lastTry: use } });
      return lockedUntil;
    });
  }

  return { check };
}

export type PasswordCheck = ReturnType<typeof makePasswordCheck>;
