// The one re-read rule, worded once: when a re-read (or re-assess) version asks a person again, their
// acknowledgement of the earlier version keeps counting until the end of the deadline day, and no longer.
// The e-mail, the procedure page, the authorisation page and the incident pack all use these words.

export const REREAD_RULE =
  'An acknowledgement of an earlier version still counts until the end of the re-read deadline; from then on only an acknowledgement of the version in force counts, and an authorisation resting on the earlier one ends there unless it is renewed.';

/** For one person: what their earlier acknowledgement does until the deadline (`dueOn` as shown to them). */
export function rereadRuleFor(earlierNumber: number | null, currentNumber: number, dueOn: string): string {
  const earlier = earlierNumber === null ? 'the earlier version' : `version ${earlierNumber}`;
  return `Your acknowledgement of ${earlier} still counts until the end of ${dueOn}; from then on only an acknowledgement of version ${currentNumber} counts, and an authorisation resting on ${earlier} ends there. Read the changes before you next do this work.`;
}

/** An earlier acknowledgement at a moment: still counted (deadline not reached) or no longer counted. */
export function earlierAckState(counts: boolean, dueOn: string | null): string {
  if (counts) return dueOn ? `an earlier version, still counted until the end of ${dueOn} (re-read deadline)` : 'an earlier version, still counted';
  return dueOn ? `an earlier version, no longer counted: the re-read deadline ${dueOn} had passed` : 'an earlier version, no longer counted';
}
