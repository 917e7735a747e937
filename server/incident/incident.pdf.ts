import { formatInZone } from '../../shared/time.js';
import { ALERT, MUTED, PdfWriter, WARN } from '../pdf/pdf-document.js';
import type { IncidentPack } from './incident.types.js';
import { earlierAckState } from '../../shared/procedures/reread-rule.js';
import { writeBenchDecision, writeRecordedLater, writeRecordSections } from './incident.pdf.records.js';

/** The pack as one PDF: what stood at the moment, section by section, with the files listed by hash. */
export async function renderIncidentPdf(p: IncidentPack): Promise<Uint8Array> {
  const tz = p.person.timeZone;
  const when = (d: Date | string) => formatInZone(d, tz);
  const pdf = await PdfWriter.create(`Incident pack: ${p.person.name} at ${p.at.toISOString()}`);
  pdf.text('Incident pack', { size: 18, bold: true, gapAfter: 4 });
  pdf.text(`${p.person.name} (${p.person.email}), ${p.person.siteName} (${p.person.siteCode})`, { bold: true });
  pdf.text(`What stood at ${when(p.at)} (${p.at.toISOString()}).`);
  pdf.text(`Produced ${when(p.producedAt)} by ${p.producedBy}. Frozen from the recorded periods, events, versions and checks as they stood then; nothing later is shown.`, { size: 9, color: MUTED });
  if (p.note) pdf.text(`Note: ${p.note}`, { size: 10 });
  pdf.rule();

  writeRecordedLater(pdf, p.records, p.at, p.person.name, when);
  pdf.heading('Authorisations and their states');
  if (!p.authorisations.length) pdf.text('None held at that moment.', { color: ALERT });
  for (const a of p.authorisations) {
    const r = a.row;
    pdf.text(`${r.scope.code} ${r.scope.title}: ${r.stateLabel} since ${when(r.since)}`, { bold: true, color: r.state === 'active' ? undefined : ALERT, gapAfter: 0 });
    pdf.text(`Valid ${r.validFrom} to ${r.validUntil}; ${r.scope.allowsLiveWork ? 'allows live work' : 'no live work'} up to ${r.scope.maxVoltageV} V, ${r.scope.maxCurrentA} A.`, { size: 9, indent: 10, gapAfter: 0 });
    for (const e of a.events) pdf.text(`${when(e.effectiveAt)} ${e.label}${e.reason ? `: ${e.reason}` : ''}${e.signedBy ? ` (signed by ${e.signedBy})` : ''}`, { size: 9, indent: 10, gapAfter: 0 });
    for (const b of a.basis) pdf.text(`Rested on: ${b.label}: ${b.detail}`, { size: 9, indent: 10, color: MUTED, gapAfter: 0 });
    if (a.paperRecord) pdf.text(`Recorded from a paper record attested by ${a.paperRecord.attestedBy}.`, { size: 9, indent: 10, color: WARN, gapAfter: 0 });
    pdf.text('', { size: 4 });
  }

  pdf.heading('Procedure versions in force and acknowledgements');
  if (!p.procedures.length) pdf.text('No procedure version was in force.', { color: MUTED });
  for (const v of p.procedures) {
    const ack = v.acknowledged;
    const said = ack ? `acknowledged version ${ack.number} on ${when(ack.at)}, signed ${ack.printedName}${ack.current ? '' : ` (${earlierAckState(ack.counts, ack.dueOn)})`}` : 'not acknowledged by then';
    pdf.text(`${v.code} version ${v.number} ${v.title} (in force since ${when(v.publishedAt)}): ${said}`, { size: 9.5, color: ack?.counts ? undefined : ALERT });
  }

  pdf.heading('Bench');
  if (!p.bench) pdf.text('No bench was named for this pack.', { color: MUTED });
  else {
    const b = p.bench;
    pdf.text(`${b.code} ${b.name} (${b.siteCode}): ${b.supply}; ${b.protection}; next inspection ${b.nextInspectionOn}; ${b.active ? 'in service' : 'out of service'}.`);
    const c = b.latestCheck;
    pdf.text(c ? `Latest pre-use check before then: ${when(c.at)} by ${c.personName}, ${c.passed ? 'passed' : 'failed'}${c.notes ? `: ${c.notes}` : ''}.` : 'No pre-use check had been recorded by then.', { color: c?.passed ? undefined : ALERT });
    for (const f of b.flags) pdf.text(`• ${f}`, { size: 9, indent: 6, color: WARN });
    writeBenchDecision(pdf, p.records, when);
  }

  pdf.heading('Test instruments and calibration');
  if (!p.instruments.length) pdf.text('None recorded.', { color: MUTED });
  for (const i of p.instruments) pdf.text(`${i.kind} ${i.make} ${i.model} SN ${i.serial} (${i.rating}), calibration due ${i.calibrationDueOn}${i.flags.length ? ` · ${i.flags.join(' · ')}` : ''}`, { size: 9.5 });

  pdf.heading('Supervised practicals');
  if (!p.practicals.length) pdf.text('None held by then.', { color: MUTED });
  for (const x of p.practicals) {
    pdf.text(`${when(x.heldAt)}: ${x.outcome}, assessed by ${x.assessorName}${x.restedOn ? ' (an authorisation rested on it)' : ''}`, { size: 9.5, gapAfter: 0 });
    for (const r of x.readings) pdf.text(r, { size: 8.5, indent: 10, gapAfter: 0, color: / failed/.test(r) ? ALERT : undefined });
    pdf.text('', { size: 4 });
  }

  writeRecordSections(pdf, p.records, when);

  pdf.heading('External certificates');
  if (!p.certificates.length) pdf.text('None uploaded by then.', { color: MUTED });
  for (const c of p.certificates) pdf.text(`${c.kind} from ${c.issuer}${c.reference ? ` (${c.reference})` : ''}, ${c.issuedOn} to ${c.expiresOn}: ${c.stateThen}`, { size: 9.5 });

  pdf.heading('Files in this pack');
  if (!p.files.length) pdf.text('None.', { color: MUTED });
  for (const f of p.files) pdf.text(`${f.fileName} (${f.mediaType}, ${f.sizeBytes} bytes) sha256 ${f.sha256}`, { size: 8.5 });

  return pdf.finish(() => ({ left: `Breakover · incident pack · ${p.person.name}`, right: `As at ${when(p.at)}` }), [`Produced ${p.producedAt.toISOString()} by ${p.producedBy}.`]);
}
