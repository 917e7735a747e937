import { formatInZone } from '../../shared/time.js';
import type { FindingView, RegisterRow } from '../../shared/register/views.js';
import { ALERT, MUTED, PdfWriter } from '../pdf/pdf-document.js';
import type { ExportContext } from './register.service.js';

const liveWork = (r: RegisterRow) => (r.scope.allowsLiveWork ? `live work up to ${r.scope.maxVoltageV} V, ${r.scope.maxCurrentA} A` : `no live work (${r.scope.maxVoltageV} V, ${r.scope.maxCurrentA} A)`);

/** The register as shown on screen, with the moment it stands for, when it was produced and by whom. */
export async function renderRegisterPdf(ctx: ExportContext, rows: RegisterRow[], findings: FindingView[]): Promise<Uint8Array> {
  const at = new Date(ctx.info.at);
  const pdf = await PdfWriter.create(`Register at ${ctx.info.at}`);
  pdf.text('Register of authorisations', { size: 18, bold: true, gapAfter: 4 });
  for (const line of ctx.lines) pdf.text(line, { size: 10 });
  pdf.text(`Produced ${formatInZone(ctx.producedAt, ctx.zone)} by ${ctx.producedBy}.`, { size: 10 });
  pdf.text(`${rows.length} row(s).`, { size: 10, color: MUTED });
  pdf.rule();

  if (!rows.length) pdf.text('No authorisation matches this filter at that moment.', { color: MUTED });
  for (const r of rows) {
    pdf.text(`${r.person.name} · ${r.site.code} · ${r.scope.code} ${r.scope.title}`, { bold: true, gapAfter: 0 });
    const state = `${r.stateLabel} since ${formatInZone(r.since, r.site.timeZone)}`;
    pdf.text(`${state} · valid ${r.validFrom} to ${r.validUntil} · ${liveWork(r)}${r.recordedFromBefore ? ' · recorded from before the portal' : ''}`, {
      size: 9, indent: 10, color: r.state === 'active' ? MUTED : ALERT, gapAfter: 4,
    });
  }

  pdf.heading('Findings');
  if (!findings.length) pdf.text('No findings recorded.', { color: MUTED });
  for (const f of findings) {
    pdf.text(`${f.severityLabel} · ${f.statusLabel} · ${f.recordLabel}`, { bold: true, gapAfter: 0 });
    pdf.text(`${f.text} (raised by ${f.raisedBy}, ${formatInZone(f.raisedAt, ctx.zone)})`, { size: 9, indent: 10, gapAfter: 0 });
    if (f.response) pdf.text(`Answer by ${f.answeredBy}: ${f.response}`, { size: 9, indent: 10, gapAfter: 0 });
    if (f.closingNote) pdf.text(`Closed by ${f.closedBy}: ${f.closingNote}`, { size: 9, indent: 10, gapAfter: 0 });
    pdf.text('', { size: 4 });
  }

  return pdf.finish(
    () => ({ left: 'Breakover · register', right: `As at ${formatInZone(at, ctx.zone)}` }),
    [`Produced ${ctx.producedAt.toISOString()} by ${ctx.producedBy}. States are derived from the recorded periods and events, not typed in.`],
  );
}
