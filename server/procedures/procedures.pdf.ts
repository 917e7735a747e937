import { formatInZone } from '../../shared/time.js';
import { CATEGORY_LABELS, CHANGE_CLASS_LABELS, STATUS_LABELS } from '../../shared/schemas/procedures.js';
import { CHECKLIST_KIND_LABELS } from '../../shared/schemas/checklists.js';
import type { VersionView } from '../../shared/procedures/views.js';
import { ALERT, MUTED, PdfWriter, WARN } from '../pdf/pdf-document.js';

// The same caution the screens show (src/components/SafetyCaution.vue), in print.
const CAUTION = [
  'Mains voltage can kill.',
  'Work live only when it is unreasonable to work dead and the precautions are in place.',
  'Feed the unit under test from an isolating transformer and the bench from an RCD (Type A or better), and know their limits: an RCD ahead of the transformer does not see a fault on its secondary, and an earthed oscilloscope clip defeats the isolation.',
  'Use test equipment rated for the circuit you measure. Figures given here are estimates; measure before you rely on them.',
  "Local regulations, the organisation's own rules and licensed practice take precedence over this document.",
];

function notInForceBanner(v: VersionView, tz: string): string | undefined {
  if (v.status === 'published') return undefined;
  if (v.status === 'superseded') return `NOT IN FORCE: superseded on ${formatInZone(v.supersededAt!, tz)}`;
  if (v.status === 'withdrawn') return `NOT IN FORCE: withdrawn on ${formatInZone(v.withdrawn!.at, tz)}`;
  return `NOT IN FORCE: ${v.status === 'draft' ? 'draft' : 'in review'}, not approved for use`;
}

export async function renderVersionPdf(v: VersionView, printedAt: Date): Promise<Uint8Array> {
  const tz = v.siteTimeZone;
  const pdf = await PdfWriter.create(`${v.code} version ${v.number}: ${v.title}`);
  pdf.text(v.title, { size: 18, bold: true, gapAfter: 4 });
  pdf.text(`${v.code} · Version ${v.number} · Status: ${STATUS_LABELS[v.status]} · ${CATEGORY_LABELS[v.category]}`, { size: 10, color: MUTED });
  if (v.status === 'published') pdf.text(`In force since ${formatInZone(v.publishedAt!, tz)}. Review by ${v.reviewDueOn}.`, { size: 10, color: MUTED });
  pdf.rule();

  pdf.heading('Safety caution', 11);
  CAUTION.forEach((line, i) => pdf.text(`• ${line}`, { size: 9.5, bold: i === 0, color: WARN, indent: 6 }));

  pdf.heading('Scope');
  pdf.text(v.scope || '(no scope written yet)');
  for (const [title, list] of [['Hazards', v.hazards], ['Personal protective equipment', v.ppe], ['Isolation and test equipment', v.equipment]] as const) {
    pdf.heading(title);
    if (!list.length) pdf.text('None listed.', { color: MUTED });
    list.forEach((h) => pdf.text(`• ${h}`, { indent: 6 }));
  }

  pdf.heading('Steps');
  v.steps.forEach((s, i) => {
    if (s.holdPoint) pdf.text(`HOLD POINT: stop. A supervisor witnesses step ${i + 1} before work goes on.`, { bold: true, color: ALERT, gapAfter: 0 });
    pdf.text(`${i + 1}. ${s.text}`, { bold: s.holdPoint });
    if (s.caution) pdf.text(`Caution: ${s.caution}`, { indent: 14, bold: true, color: WARN, gapAfter: 4 });
  });

  for (const c of v.checklists) {
    pdf.heading(`Checklist: ${c.title}`, 12);
    pdf.text(CHECKLIST_KIND_LABELS[c.kind], { color: MUTED });
    c.items.forEach((item, n) => {
      const what = item.kind === 'measurement' ? `Measure (${item.unit}): ${item.prompt}` : item.kind === 'evidence' ? `Evidence required: ${item.prompt}` : item.prompt;
      pdf.box(`${n + 1}. ${what}`);
      if (item.ruleText) pdf.text(`Accept: ${item.ruleText}`, { indent: 14, size: 9, color: MUTED });
      if (item.guidance) pdf.text(item.guidance, { indent: 14, size: 9, color: MUTED });
    });
  }

  if (v.number > 1) {
    pdf.heading('What changed');
    pdf.text(v.changeClass ? CHANGE_CLASS_LABELS[v.changeClass] : 'Change class not chosen yet.', { bold: true });
    pdf.text(v.changeSummary ?? '(no summary yet)');
  }

  pdf.heading('Signatures');
  pdf.text(`Author: ${v.author.name}${v.editors.length ? `; also edited by ${v.editors.map((e) => e.name).join(', ')}` : ''}`);
  if (v.approval) {
    pdf.text(`Approved by: ${v.approval.printedName}`, { bold: true });
    pdf.text(`Signed: ${formatInZone(v.approval.signedAt, tz)}`);
    pdf.text(`Meaning of the signature: "${v.approval.meaning}"`);
  } else {
    pdf.text('Not approved: this version is not for use.', { bold: true, color: ALERT });
  }

  const banner = notInForceBanner(v, tz);
  return pdf.finish(
    () => ({ left: `${v.code} v${v.number}: ${v.title}`, right: STATUS_LABELS[v.status].toUpperCase(), banner }),
    [
      `Uncontrolled when printed: check Breakover for the version in force. Printed ${formatInZone(printedAt, tz)}.`,
      ...(banner ? [`${banner}.`] : []),
    ],
  );
}
