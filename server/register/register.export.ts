import { createHash } from 'node:crypto';
import { once } from 'node:events';
import type { Response } from 'express';
import { csvStream } from '../csv.js';
import type { Deps } from '../deps.js';
import type { Actor } from '../../shared/abilities.js';
import { eachRegisterBatch } from './register.cursor.js';
import { CSV_COLUMNS, csvLine, presentRow } from './register.present.js';
import { renderRegisterPdf } from './register.pdf.js';
import type { ExportContext } from './register.service.js';
import type { FindingView, RegisterRow } from '../../shared/register/views.js';

const stamp = (d: Date) => d.toISOString().replace(/[:]/g, '').replace(/\.\d+Z$/, 'Z');
export const exportName = (ctx: ExportContext, ext: string) => `register-${stamp(new Date(ctx.info.at))}.${ext}`;

export function makeRegisterExports(deps: Deps) {
  const { db, audit } = deps;

  const record = (tx: Parameters<Parameters<typeof db.transaction>[0]>[0], actor: Actor, ctx: ExportContext, format: string, rows: number, sha256: string) =>
    audit(tx, {
      actorId: actor.id, action: 'register.exported', entity: 'register', entityId: ctx.info.at,
      newValues: { format, at: ctx.info.at, view: ctx.info.view, filter: ctx.filter, rows, sha256, producedAt: ctx.producedAt.toISOString() },
    });

  /**
   * Streams the CSV: a head stating the moment, when and by whom, then one line per row. The audit entry
   * (with the row count and the hash of what was sent) commits with the read; the response ends after it.
   */
  async function csv(actor: Actor, ctx: ExportContext, res: Response) {
    res.setHeader('Content-Type', 'text/csv; charset=utf-8');
    res.setHeader('Content-Disposition', `attachment; filename="${exportName(ctx, 'csv')}"`);
    res.setHeader('Cache-Control', 'no-store');
    const out = csvStream();
    const hash = createHash('sha256');
    out.on('data', (chunk: Buffer) => hash.update(chunk));
    out.pipe(res, { end: false });
    const write = async (line: (string | number)[]) => {
      if (!out.write(line)) await once(out, 'drain');
    };
    try {
      await db.transaction(async (tx) => {
        for (const l of ctx.lines) await write([l]);
        await write([`Produced ${ctx.producedAt.toISOString()} by ${ctx.producedBy}`]);
        await write([]);
        await write(CSV_COLUMNS);
        let rows = 0;
        await eachRegisterBatch(tx, ctx.where, ctx.filter.sort, ctx.filter.dir, async (batch) => {
          for (const r of batch) await write(csvLine(presentRow(r)));
          rows += batch.length;
        });
        out.end();
        await once(out, 'end');
        await record(tx, actor, ctx, 'csv', rows, hash.digest('hex'));
      });
      res.end();
    } catch (err) {
      // The head went out already: break the transfer so no one mistakes a partial file for the register.
      if (res.headersSent) res.destroy(err as Error);
      else throw err;
    }
  }

  async function pdf(actor: Actor, ctx: ExportContext, rows: RegisterRow[], findings: FindingView[]) {
    const bytes = await renderRegisterPdf(ctx, rows, findings);
    const sha256 = createHash('sha256').update(bytes).digest('hex');
    await db.transaction((tx) => record(tx, actor, ctx, 'pdf', rows.length, sha256));
    return { bytes, fileName: exportName(ctx, 'pdf') };
  }

  return { csv, pdf };
}
export type RegisterExports = ReturnType<typeof makeRegisterExports>;
