import { ZxcvbnFactory, type ZxcvbnResult } from '@zxcvbn-ts/core';
import { adjacencyGraphs, dictionary } from '@zxcvbn-ts/language-common';
import { PASSWORD_MAX, PASSWORD_MIN } from './password-rules.js';
import { containsPersonal, fold, isCommon, personalWords } from './password-patterns.js';

// The server decides with this; the client loads it lazily (it carries the word lists) to say the same while typing.

export const PASSWORD_MESSAGES = {
  common: 'this password is too common; choose another',
  commonVariant: 'this password is too common; digits, a year or look-alike symbols added to a common password do not make it safe',
  personal: 'do not use your name, e-mail or the name of this service in the password',
  guessable: 'this password is too easy to guess (common words, keyboard rows, dates or repeats); a few unrelated words make a stronger one',
} as const;

/**
 * zxcvbn score 4 means at least 10^10 guesses, the level its authors give as strong protection when a
 * database of slow hashes (ours: bcrypt cost 12) is stolen; score 3 is 10^8, a day or so of one GPU
 * at that cost. Online guessing is held back by the sign-in limits, so the stolen-hash case is the one
 * the estimator guards. A 15-character password made of a few unrelated words clears 10^10 easily.
 */
export const MIN_SCORE = 4;

let common: Set<string> | null = null;
let estimator: ZxcvbnFactory | null = null;

function commonSet(): Set<string> {
  return (common ??= new Set(dictionary['passwords-common'].map((w) => fold(w))));
}

// Bounded work per check (it runs on the server's event loop and on every keystroke): the first 64
// characters are judged (a longer password is only stronger than its start), and look-alike
// substitutions are tried 20 ways at most; near-miss spelling (Levenshtein) cost ~100 ms a check and is
// left out, the explicit checks covering common passwords dressed up. Worst case measured: ~80 ms.
function estimate(password: string, inputs: string[]): ZxcvbnResult {
  estimator ??= new ZxcvbnFactory({ dictionary, graphs: adjacencyGraphs, maxLength: 64, l33tMaxSubstitutions: 20 });
  return estimator.check(password, inputs);
}

/** Why a new password is refused, or null. `context` holds the person's name and e-mail local part. */
export function passwordVerdict(password: string, context: string[] = []): string | null {
  const pw = password.normalize('NFKC');
  const chars = [...pw].length;
  if (chars < PASSWORD_MIN) return `use at least ${PASSWORD_MIN} characters`;
  if (chars > PASSWORD_MAX) return `use at most ${PASSWORD_MAX} characters`;
  const folded = fold(pw);
  const kind = isCommon(folded, commonSet());
  if (kind) return kind === 'exact' ? PASSWORD_MESSAGES.common : PASSWORD_MESSAGES.commonVariant;
  if (containsPersonal(folded, context)) return PASSWORD_MESSAGES.personal;
  const { anywhere, asWord } = personalWords(context);
  return estimate(pw, [...anywhere, ...asWord]).score >= MIN_SCORE ? null : PASSWORD_MESSAGES.guessable;
}
