import type { ChecklistInput, ChecklistItemInput } from '../../../shared/schemas/checklists.js';
import type { ChangeClass, ProcedureCategory } from '../../../shared/schemas/procedures.js';

/** A step with a local name, so the same step keeps its key from one version to the next. */
export interface SeedStep {
  id: string;
  text: string;
  caution?: string;
  holdPoint?: boolean;
}

/** A checklist whose items name the step they belong to by its local name (dropped where the version lacks it). */
export type SeedChecklist = Omit<ChecklistInput, 'items'> & { items: (ChecklistItemInput & { step?: string })[] };

export interface SeedVersion {
  title: string;
  scope: string;
  hazards: string[];
  ppe: string[];
  equipment: string[];
  steps: SeedStep[];
  checklists: SeedChecklist[];
  change?: { changeClass: ChangeClass; summary: string };
  rereadDays?: number;
  /** Days before the demo is seeded that this version was published (omitted: left in review). */
  publishedDaysAgo?: number;
}

export interface SeedProcedure {
  code: string;
  site: string;
  category: ProcedureCategory;
  reviewPeriodMonths: number;
  author: string;
  approver: string;
  versions: SeedVersion[];
  /** Who acknowledged which version number (by e-mail). */
  acknowledgements: { email: string; version: number }[];
}
