import { PASSWORD_MAX, PASSWORD_MIN } from '@shared/password-rules';

/** The password policy as the server applies it (NIST SP 800-63B): length here; the rest in usePasswordVerdict. */
export function usePasswordRules() {
  // Counted as the server counts: characters, not UTF-16 units.
  const length = (v: string | null | undefined) => [...(v ?? '').normalize('NFKC')].length;
  const rules = [
    (v: string) => length(v) >= PASSWORD_MIN || `Use at least ${PASSWORD_MIN} characters.`,
    (v: string) => length(v) <= PASSWORD_MAX || `Use at most ${PASSWORD_MAX} characters.`,
  ];
  const hints = [
    `At least ${PASSWORD_MIN} characters and at most ${PASSWORD_MAX}.`,
    'Any characters you like, spaces included; a few unrelated words make a good one.',
    'No rules about capitals, digits or symbols.',
    'Common passwords (also with digits, a year or look-alike symbols added), easily guessed patterns, and ones containing your name, your e-mail address or “Breakover” are refused.',
  ];
  return { rules, hints, min: PASSWORD_MIN, max: PASSWORD_MAX };
}
