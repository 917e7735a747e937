// Words and lists of the sign-offs and practicals, in a zod-free module so client pages can show them cheaply.

export const SIGNOFF_KINDS = ['self-sign-off', 'bench-pre-use'] as const;
export type SignoffKind = (typeof SIGNOFF_KINDS)[number];
export const SIGNOFF_KIND_LABELS: Record<SignoffKind, string> = { 'self-sign-off': 'Self sign-off', 'bench-pre-use': 'Bench pre-use check' };

export const SIGNOFF_STATUSES = ['in_progress', 'submitted', 'countersigned', 'returned', 'recorded'] as const;
export type SignoffStatus = (typeof SIGNOFF_STATUSES)[number];
export const SIGNOFF_STATUS_LABELS: Record<SignoffStatus, string> = {
  in_progress: 'Being filled in',
  submitted: 'Signed, awaiting countersignature',
  countersigned: 'Countersigned',
  returned: 'Returned for correction',
  recorded: 'Signed pre-use check',
};

export const COMPLETED_MEANING = 'completed as recorded';
export const COUNTERSIGNED_MEANING = 'countersigned';

export const LOAD_KINDS = ['resistance', 'rated', 'resistive-inductive', 'lamp-filament', 'universal-motor'] as const;
export type CircuitLoadKind = (typeof LOAD_KINDS)[number];
export const LOAD_KIND_LABELS: Record<CircuitLoadKind, string> = {
  resistance: 'Resistance (heater element)',
  rated: 'Heater given by rated power',
  'resistive-inductive': 'Resistance with inductance (R-L)',
  'lamp-filament': 'Incandescent lamp',
  'universal-motor': 'Universal motor',
};

export const OUTCOMES = ['competent', 'not_yet_competent'] as const;
export type Outcome = (typeof OUTCOMES)[number];
export const OUTCOME_LABELS: Record<Outcome, string> = { competent: 'Competent', not_yet_competent: 'Not yet competent' };

export const PRACTICAL_STATUSES = ['in_progress', 'assessed', 'acknowledged'] as const;
export type PracticalStatus = (typeof PRACTICAL_STATUSES)[number];
export const PRACTICAL_STATUS_LABELS: Record<PracticalStatus, string> = {
  in_progress: 'Being recorded',
  assessed: 'Signed by the assessor, awaiting the technician',
  acknowledged: 'Signed by both',
};

export const ASSESSED_MEANING = 'assessed';
export const ACKNOWLEDGED_MEANING = 'outcome acknowledged';
