import { z } from 'zod';
import './messages.js';

/*
 * Free text that reaches certificates, PDFs, CSV files and the public verification page. Refused:
 * - control characters (NUL, the rest of C0, DEL and C1; tab and newline only in multi-line text);
 * - unpaired surrogates (not text at all; PostgreSQL and PDF fonts cannot hold them);
 * - bidi embeddings, overrides and isolates (U+202A–202E, U+2066–2069): they reorder letters on screen,
 *   so "Smith" can be stored and shown as something else, and an unclosed one spills into what follows.
 * The marks U+200E, U+200F and U+061C are kept: they change no letter's order, only where neutral signs
 * go, and mixed-direction names need them. Line and paragraph separators count as line breaks.
 * Text is NFC-normalised so one name has one spelling.
 */
const CONTROL_SINGLE = /[\u0000-\u001f\u007f-\u009f\u2028\u2029]/;
const CONTROL_MULTI = /[\u0000-\u0008\u000b-\u001f\u007f-\u009f\u2028\u2029]/;
const BIDI = /[\u202a-\u202e\u2066-\u2069]/;
// Hangul fillers are letters by category yet draw nothing.
const FILLERS = /[\u115f\u1160\u3164\uffa0]/gu;
const LETTER = /\p{L}/u;
const LONE_SURROGATE = /[\ud800-\udbff](?![\udc00-\udfff])|(?<![\ud800-\udbff])[\udc00-\udfff]/;
const VISIBLE = /[^\p{White_Space}\p{Cc}\p{Cf}\p{Mn}\p{Me}\u115f\u1160\u3164\uffa0\u034f]/u;

export const TEXT_MESSAGES = {
  control: 'must not contain control characters',
  lineBreak: 'must be on one line',
  surrogate: 'must not contain broken characters (unpaired surrogates)',
  bidi: 'must not contain characters that reverse the reading direction',
  invisible: 'must contain something visible',
  letter: 'must contain a letter',
} as const;

export interface TextRules { multiline?: boolean; letter?: boolean }

/** What is wrong with a text under the rules, in plain words, or null; also used for CSV import cells. */
export function textProblem(v: string, rules: TextRules = {}): string | null {
  if (LONE_SURROGATE.test(v)) return TEXT_MESSAGES.surrogate;
  if (!rules.multiline && /[\n\r\u2028\u2029]/.test(v)) return TEXT_MESSAGES.lineBreak;
  if ((rules.multiline ? CONTROL_MULTI : CONTROL_SINGLE).test(v)) return TEXT_MESSAGES.control;
  if (BIDI.test(v)) return TEXT_MESSAGES.bidi;
  if (v === '') return null; // emptiness is each field's own rule (min length, optional)
  if (!VISIBLE.test(v)) return TEXT_MESSAGES.invisible;
  if (rules.letter && !LETTER.test(v.replace(FILLERS, ''))) return TEXT_MESSAGES.letter;
  return null;
}

/** The same cleaning the schemas do before their checks: NFC, CRLF as LF, trimmed. */
export function cleanText(v: string): string {
  return v.normalize('NFC').replace(/\r\n/g, '\n').trim();
}

function checked(rules: TextRules) {
  return z.string().overwrite(cleanText).superRefine((v, ctx) => {
    const problem = textProblem(v, rules);
    if (problem) ctx.addIssue({ code: 'custom', message: problem, input: v });
  });
}

/** One line of free text (titles, reasons, notes kept short, search words). Chain .min/.max as usual. */
export const line = () => checked({});
/** Multi-line free text: newlines and tabs allowed. */
export const paragraph = () => checked({ multiline: true });
/** A name of a person, a site, a bench, an issuer: one line with at least one letter. */
export const name = () => checked({ letter: true });
