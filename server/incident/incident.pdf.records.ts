import { ALERT, MUTED, WARN, type PdfWriter } from '../pdf/pdf-document.js';
import type { PackRecords } from './records.then.js';

type When = (d: Date | string) => string;

/** Before the other sections: when the moment precedes the person's account, what is shown was recorded later. */
export function writeRecordedLater(pdf: PdfWriter, r: PackRecords, at: Date, name: string, when: When) {
  if (at < r.accountCreatedAt) {
    pdf.text(`${name}'s account was created on ${when(r.accountCreatedAt)}, after this moment: everything below for this moment was recorded later, from paper records.`, { color: WARN });
  }
  if (!r.recordedLater.length) return;
  pdf.heading('Recorded later');
  for (const e of r.recordedLater) {
    const paper = e.paperAttestedBy ? `, from a paper record attested by ${e.paperAttestedBy}` : '';
    pdf.text(`${e.scope}: ${e.label}, effective ${when(e.effectiveAt)}, recorded ${when(e.recordedAt)}${paper}.`, { size: 9, color: WARN, gapAfter: 0 });
  }
  pdf.text('', { size: 4 });
}

/** Within the bench section: a manager's decision accepting its Type AC RCD, as it stood then. */
export function writeBenchDecision(pdf: PdfWriter, r: PackRecords, when: When) {
  const d = r.benchTypeAcDecision;
  if (d) pdf.text(`Type AC RCD accepted for practicals by ${d.byName} on ${when(d.at)}: ${d.reason}`, { size: 9, indent: 6, color: WARN });
}

/** What each practical was held on, and the person's sign-offs with their evidence. */
export function writeRecordSections(pdf: PdfWriter, r: PackRecords, when: When) {
  pdf.heading('How each practical was set up');
  if (!r.practicalSettings.length) pdf.text('None held by then.', { color: MUTED });
  for (const p of r.practicalSettings) {
    pdf.text(`${when(p.heldAt)}: ${p.procedure}`, { size: 9.5, bold: true, gapAfter: 0 });
    pdf.text(`Bench ${p.bench}; instruments: ${p.instruments.length ? p.instruments.join(', ') : 'none named'}.`, { size: 9, indent: 10, gapAfter: 0 });
    if (p.crossSiteReason) pdf.text(`Bench at another site than the technician's. Reason given: ${p.crossSiteReason}`, { size: 9, indent: 10, gapAfter: 0 });
    if (p.typeAcDecision) {
      const d = p.typeAcDecision;
      pdf.text(`Type AC RCD accepted by ${d.byName} on ${when(d.at)}: ${d.reason}`, { size: 9, indent: 10, color: WARN, gapAfter: 0 });
    }
    pdf.text('', { size: 4 });
  }

  pdf.heading('Sign-offs');
  if (!r.signoffs.length) pdf.text('None started by then.', { color: MUTED });
  for (const s of r.signoffs) {
    const signed = s.submittedAt ? `, signed ${when(s.submittedAt)}` : '';
    pdf.text(`${s.procedure} ${s.title}: started ${when(s.startedAt)}${signed}; ${s.stateThen}.`, { size: 9.5, color: s.stateThen.startsWith('countersigned') ? undefined : ALERT, gapAfter: 0 });
    for (const f of s.files) pdf.text(`Evidence: ${f.fileName} sha256 ${f.sha256}`, { size: 8.5, indent: 10, gapAfter: 0 });
    pdf.text('', { size: 4 });
  }
}
