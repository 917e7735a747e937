import type { Deps } from '../deps.js';
import type { Actor } from '../../shared/abilities.js';
import type { SessionUser } from '../../shared/schemas/auth.js';
import type { PersonTerm } from '../../shared/roles.js';
import { endOfLocalDay } from '../../shared/time.js';
import { AppError, notFound, unprocessable } from '../errors.js';
import { findUserByEmail, findUserById, rolesOf, coveredSitesOf, updateUser, type UserRow } from '../people/people.repository.js';
import { findSite } from '../sites/sites.repository.js';
import { hashPassword, passwordProblem } from './password.js';
import { lockedError, makePasswordCheck } from './password-check.js';
import { deleteSessionsOf } from './sessions.repository.js';
import { findTokenByHash, insertToken, markTokenUsed, retireOpenTokens } from './tokens.repository.js';
import { hashToken, newToken } from './tokens.js';

const BAD_CREDENTIALS = () => new AppError(401, 'bad_credentials', 'E-mail or password is not right.');

export function makeAuthService(deps: Deps) {
  const { db, clock, config, audit, mailer } = deps;
  const passwords = makePasswordCheck(deps);

  /** An auditor account with an end date stops working after the end of that day at its site. */
  async function accessEnded(user: UserRow): Promise<boolean> {
    if (!user.accessEndsOn) return false;
    const site = await findSite(db, user.siteId);
    return clock.now() >= endOfLocalDay(user.accessEndsOn, site?.timeZone ?? 'UTC');
  }

  async function signIn(email: string, password: string): Promise<UserRow> {
    const user = await findUserByEmail(db, email);
    const verdict = await passwords.check(user, password, 'sign-in');
    if (verdict.result === 'locked') throw lockedError(verdict.minutes);
    if (verdict.result === 'wrong' || !user) throw BAD_CREDENTIALS();
    if (!user.active) throw new AppError(401, 'deactivated', 'This account has been deactivated. Ask your workshop manager.');
    if (await accessEnded(user)) throw new AppError(401, 'access_ended', 'The access period of this account has ended.');
    await db.transaction((tx) => audit(tx, { actorId: user.id, action: 'session.signed_in', entity: 'user', entityId: user.id }));
    return user;
  }

  /** Loads the actor for a session; null when the person is gone, deactivated or past their access end. */
  async function loadActor(userId: string): Promise<{ actor: Actor; user: SessionUser } | null> {
    const user = await findUserById(db, userId);
    if (!user || !user.active || (await accessEnded(user))) return null;
    const [roles, covered, site] = await Promise.all([rolesOf(db, user.id), coveredSitesOf(db, user.id), findSite(db, user.siteId)]);
    if (!site) return null;
    const siteIds = [...new Set([user.siteId, ...covered])];
    return {
      actor: { id: user.id, roles, siteId: user.siteId, siteIds },
      user: {
        id: user.id, email: user.email, name: user.name, roles, siteIds,
        site: { id: site.id, code: site.code, name: site.name, timeZone: site.timeZone, personTerm: site.personTerm as PersonTerm },
      },
    };
  }

  async function issueLink(userId: string, email: string, name: string, purpose: 'invite' | 'reset', actorId: string | null) {
    const { token, hash } = newToken();
    const now = clock.now();
    const ttl = purpose === 'invite' ? config.tokens.inviteMs : config.tokens.resetMs;
    const link = `${config.publicUrl}/set-password?token=${token}`;
    const hours = Math.round(ttl / 3_600_000);
    const text = purpose === 'invite'
      ? `Hello ${name},\n\nYou have been given an account on Breakover, the workshop's record of live-work training and authorisations.\n\nSet your password here (the link works once and expires in ${hours} hours):\n${link}\n`
      : `Hello ${name},\n\nSomeone asked to reset the Breakover password for ${email}. If it was you, set a new password here (the link works once and expires in ${Math.round(ttl / 60_000)} minutes):\n${link}\n\nIf it was not you, ignore this message; your password stays as it is.\n`;
    const mail = { to: email, subject: purpose === 'invite' ? 'Your Breakover account' : 'Reset your Breakover password', text, kind: purpose };
    // The link's message is recorded with the token: both exist, or neither. The queue delivers it after commit.
    await db.transaction(async (tx) => {
      await retireOpenTokens(tx, userId, purpose, now);
      await insertToken(tx, { userId, purpose, tokenHash: hash, expiresAt: new Date(now.getTime() + ttl), createdAt: now });
      await audit(tx, { actorId, action: `account.${purpose}_link_issued`, entity: 'user', entityId: userId });
      await mailer.enqueue(tx, mail, { key: `link:${hash}` });
    });
    await mailer.wake();
  }

  async function tokenInfo(token: string) {
    const row = await findTokenByHash(db, hashToken(token));
    if (!row || row.token.usedAt || row.token.expiresAt <= clock.now() || !row.user.active) throw notFound('That link (it may have been used or have expired)');
    return { email: row.user.email, name: row.user.name, purpose: row.token.purpose };
  }

  async function setPassword(token: string, password: string) {
    const hash = await db.transaction(async (tx) => {
      const row = await findTokenByHash(tx, hashToken(token), true);
      if (!row || row.token.usedAt || row.token.expiresAt <= clock.now() || !row.user.active) throw notFound('That link (it may have been used or have expired)');
      const problem = passwordProblem(password, [row.user.email.split('@')[0], ...row.user.name.split(/\s+/)]);
      if (problem) throw unprocessable(`password: ${problem}`, { password: problem });
      const passwordHash = await hashPassword(password);
      await markTokenUsed(tx, row.token.id, clock.now());
      await updateUser(tx, row.user.id, { passwordHash, failedSignIns: 0, lockedUntil: null, updatedAt: clock.now() });
      // Whoever held a session with the old password (or got one through it) is signed out everywhere.
      const sessionsEnded = await deleteSessionsOf(tx, row.user.id);
      await audit(tx, { actorId: row.user.id, action: 'account.password_set', entity: 'user', entityId: row.user.id, newValues: { via: row.token.purpose, sessionsEnded } });
      return row.user.email;
    });
    return { email: hash };
  }

  async function forgotPassword(email: string) {
    const user = await findUserByEmail(db, email);
    if (user && user.active) await issueLink(user.id, user.email, user.name, 'reset', null);
  }

  /** Ends every other session of the person; the one that made the change (`keepSid`) stays. */
  async function changePassword(userId: string, current: string, next: string, keepSid: string) {
    const user = await findUserById(db, userId);
    const verdict = await passwords.check(user, current, 'password-change');
    if (verdict.result === 'locked') throw lockedError(verdict.minutes, 'currentPassword');
    if (verdict.result === 'wrong' || !user) {
      throw unprocessable('currentPassword: the current password is not right', { currentPassword: 'the current password is not right' });
    }
    const problem = passwordProblem(next, [user.email.split('@')[0], ...user.name.split(/\s+/)]);
    if (problem) throw unprocessable(`newPassword: ${problem}`, { newPassword: problem });
    const passwordHash = await hashPassword(next);
    await db.transaction(async (tx) => {
      await updateUser(tx, userId, { passwordHash, updatedAt: clock.now() });
      const sessionsEnded = await deleteSessionsOf(tx, userId, keepSid);
      await audit(tx, { actorId: userId, action: 'account.password_changed', entity: 'user', entityId: userId, newValues: { sessionsEnded } });
    });
  }

  /**
   * Electronic signatures: the signer re-enters their password at the moment of signing, through the same
   * check as sign-in (a wrong one counts towards the lock, a locked account cannot sign). Called before the
   * transaction of the signed change, so a refusal changes nothing but the count.
   */
  async function confirmSignature(userId: string, password: string | undefined) {
    if (!password) throw unprocessable('password: re-enter your own password to sign', { password: 're-enter your own password to sign' });
    const user = await findUserById(db, userId);
    const verdict = await passwords.check(user, password, 'signature');
    if (verdict.result === 'locked') throw lockedError(verdict.minutes, 'password');
    if (verdict.result === 'wrong' || !user) throw unprocessable('password: re-enter your own password to sign', { password: 'the password is not right' });
    if (!user.active) throw unprocessable('password: this account has been deactivated', { password: 'this account has been deactivated' });
    return user;
  }

  async function recordSignOut(userId: string) {
    await db.transaction((tx) => audit(tx, { actorId: userId, action: 'session.signed_out', entity: 'user', entityId: userId }));
  }

  return { signIn, loadActor, issueLink, tokenInfo, setPassword, forgotPassword, changePassword, confirmSignature, recordSignOut };
}

export type AuthService = ReturnType<typeof makeAuthService>;
