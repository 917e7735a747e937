import type { RowEvidenceView } from '../../shared/register/views.js';
import type { FileMeta } from '../register/evidence.repository.js';
import type { PackRecords } from './records.then.js';

/** Everything an incident pack holds, frozen at one moment; the PDF and the ZIP are made from this. */
export interface IncidentPack {
  at: Date;
  producedAt: Date;
  producedBy: string;
  note: string;
  person: { id: string; name: string; email: string; siteCode: string; siteName: string; timeZone: string };
  authorisations: RowEvidenceView[];
  procedures: { code: string; number: number; title: string; publishedAt: Date; acknowledged: { number: number; at: Date; printedName: string; counts: boolean; current: boolean; dueOn: string | null } | null }[];
  bench: null | {
    siteId: string; timeZone: string; code: string; name: string; siteCode: string; supply: string; protection: string; nextInspectionOn: string; active: boolean;
    flags: string[]; latestCheck: { at: Date; passed: boolean; notes: string | null; personName: string; files: FileMeta[] } | null;
  };
  instruments: { kind: string; make: string; model: string; serial: string; rating: string; calibrationDueOn: string; flags: string[] }[];
  practicals: { id: string; heldAt: Date; assessorName: string; outcome: string; restedOn: boolean; files: FileMeta[];
    /** Every reading taken by then, one line each (failed ones and those taken again included). */
    readings: string[] }[];
  certificates: { id: string; kind: string; issuer: string; reference: string; issuedOn: string; expiresOn: string; stateThen: string; files: FileMeta[] }[];
  /** Sign-offs, how each practical was set up, and what was recorded later than the moment. */
  records: PackRecords;
  /** Every file behind the records above, once each: what goes into the ZIP beside the PDF. */
  files: PackFile[];
}

export type PackFile = Omit<FileMeta, 'uploadedAt'>;
