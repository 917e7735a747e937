import { describe, it, expect } from 'vitest';
import { hashPassword, passwordProblem, verifyPassword } from '../../../server/auth/password.js';
import { DEMO_PASSWORD } from '../../../server/seed/demo-people.js';
import { ROLE_PASSWORD } from '../../support/role-users.js';
import { PERSON_PASSWORD } from '../../support/authorisations.js';

describe('password rules (NIST SP 800-63B rev. 4, section 3.1.1.2, single-factor passwords)', () => {
  it('when shorter than 15 characters, then refused; 15 is accepted', () => {
    expect(passwordProblem('tin can rebound')).toBeNull(); // 15 characters
    expect(passwordProblem('tin can rebound'.slice(0, 14))).toMatch(/at least 15/);
  });

  it('when up to 128 characters (at least 64 must be allowed), then accepted', () => {
    const long = 'the isolating transformer hums '.repeat(5).slice(0, 128);
    expect(long.length).toBe(128);
    expect(passwordProblem(long)).toBeNull();
    expect(passwordProblem(long + 'x')).toMatch(/at most 128/);
  });

  it('when there is no mix of character classes, then it is still accepted (no composition rules)', () => {
    expect(passwordProblem('lowercase words only here')).toBeNull();
  });

  it('when on the bundled common-password list, or a common word repeated, then refused', () => {
    expect(passwordProblem('1234567890123456')).toMatch(/common/); // a sequence
    expect(passwordProblem('abcdefghijklmnopq')).toMatch(/common/);
    expect(passwordProblem('passwordpassword')).toMatch(/common/);
    expect(passwordProblem('aaaaaaaaaaaaaaaa')).toMatch(/common/);
    expect(passwordProblem('qwertyqwertyqwerty')).toMatch(/common/);
  });

  it('when it contains the service name or the person\'s own name, then refused', () => {
    expect(passwordProblem('my breakover account pass')).toMatch(/name/);
    expect(passwordProblem('tomasz likes long passwords', ['tomasz'])).toMatch(/name/);
  });
});

describe('common passwords dressed up, names, and the strength estimate', () => {
  const person = ['amelie.fournier84', 'Amélie', 'Fournier'];

  it.each([
    ['password12345678'],
    ['Password2024!!!!'],
    ['p@ssw0rd1234567'],
    ['qwertyuiop123456'],
    ['iloveyou20252025'],
    ['$uperman20242024'],
    ['2024football2024'],
    ['hell0w0rld123456'],
  ])('when a common password has digits, a year or look-alikes added (%s), then it is refused as common', (pw) => {
    expect(passwordProblem(pw)).toMatch(/too common/);
  });

  it.each([
    ['amelie likes long rides'],
    ['AMÉLIE likes long rides'],
    ['f0urn1er on the night bus'],
    ['the fournier bench at lunch'],
    ['my fournier84 was here now'],
  ])('when the password contains the person\'s name or e-mail part (%s), then it is refused naming that', (pw) => {
    expect(passwordProblem(pw, person)).toBe('do not use your name, e-mail or the name of this service in the password');
  });

  it('when a three-letter name stands as its own word, then refused; inside another word, then allowed', () => {
    expect(passwordProblem('tom goes to the bench today', ['tom', 'Tom', 'Li'])).toMatch(/your name/);
    expect(passwordProblem('bottom of the bench drawer', ['tom', 'Tom', 'Li'])).toBeNull();
  });

  it('when common words or patterns are only combined, then the estimate refuses it as easy to guess', () => {
    expect(passwordProblem('sunshine2024sunshine')).toMatch(/too easy to guess/);
    expect(passwordProblem('greenhousetomato')).toMatch(/too easy to guess/);
    expect(passwordProblem('Summer2024Summer')).toMatch(/too easy to guess/);
    expect(passwordProblem('P@$$w0rd!2024abc')).toMatch(/too easy to guess/);
  });

  it.each([
    ['maple cobalt river thimble'],
    ['orbit-velvet-pickle-lantern'],
    ['correct horse battery staple'],
    ['amber-lamp-on-bench-4'], // the demo password
    ['copper tape on the heatsink fins'],
    ['Jörg at the bench fifteen'],
  ])('when the password is a few unrelated words (%s), then it passes', (pw) => {
    expect(passwordProblem(pw, person)).toBeNull();
  });

  it('when the demo and test people\'s passwords are checked, then they pass (the suite signs in with them)', () => {
    for (const pw of [DEMO_PASSWORD, ROLE_PASSWORD, PERSON_PASSWORD]) expect(passwordProblem(pw, ['someone', 'Pat', 'Doe'])).toBeNull();
  });

  it('when 128 characters of look-alike symbols are checked, then the answer still comes (bounded work)', () => {
    expect(passwordProblem('p@$$w0rd1l!|'.repeat(11).slice(0, 128))).not.toBeNull();
  });
});

describe('hashing beyond bcrypt\'s 72 bytes', () => {
  it('when two long passwords differ only after byte 72, then they do not verify as each other', async () => {
    const head = 'x'.repeat(80);
    const hash = await hashPassword(head + 'A');
    expect(await verifyPassword(head + 'A', hash)).toBe(true);
    expect(await verifyPassword(head + 'B', hash)).toBe(false);
  });

  it('when the same password is typed in another Unicode form, then it verifies (NFKC)', async () => {
    const composed = 'Jörg at the bench fifteen';
    const decomposed = composed.normalize('NFD');
    expect(decomposed).not.toBe(composed);
    expect(await verifyPassword(decomposed, await hashPassword(composed))).toBe(true);
  });
});
