import { describe, it, expect } from 'vitest';
import { hashPassword, passwordProblem, verifyPassword } from '../../../server/auth/password.js';

describe('password rules (NIST SP 800-63B rev. 4, section 3.1.1.2, single-factor passwords)', () => {
  it('when shorter than 15 characters, then refused; 15 is accepted', () => {
    expect(passwordProblem('a'.repeat(3) + 'bcdefghijklm')).toBeNull(); // 15 characters
    expect(passwordProblem('bcdefghijklmno'.slice(0, 14))).toMatch(/at least 15/);
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
