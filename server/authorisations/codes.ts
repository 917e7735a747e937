import { randomBytes } from 'node:crypto';

const ALPHABET = 'ABCDEFGHIJKLMNOPQRSTUVWXYZ234567';

/** 160 random bits as 32 base32 letters (RFC 4648 alphabet): unguessable, easy to read out and type. */
export function newVerificationCode(): string {
  const bytes = randomBytes(20);
  let bits = 0;
  let value = 0;
  let out = '';
  for (const byte of bytes) {
    value = (value << 8) | byte;
    bits += 8;
    while (bits >= 5) {
      out += ALPHABET[(value >>> (bits - 5)) & 31];
      bits -= 5;
    }
  }
  return out;
}

/** Codes are read off paper: accept lower case, spaces and hyphens. */
export function normaliseCode(raw: string): string | null {
  const code = raw.toUpperCase().replace(/[\s-]/g, '');
  return /^[A-Z2-7]{32}$/.test(code) ? code : null;
}
