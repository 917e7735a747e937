import type { Deps } from '../deps.js';
import type { Actor, AppAbility } from '../../shared/abilities.js';
import type { ImportBody } from '../../shared/schemas/authorisations.js';
import type { ImportJobView, ImportReport } from '../../shared/authorisations/views.js';
import type { Signatures } from '../signatures/signatures.service.js';
import { AppError, unprocessable } from '../errors.js';
import { parseImport } from './import.parse.js';
import { checkImport, type PlannedRow } from './import.check.js';
import { writeImport, type Signer } from './import.write.js';

/** Above this many rows a real run goes to the job queue, so no browser request holds a transaction for long. */
export const LARGE_IMPORT_ROWS = 200;

/** Hands a checked, signed large import to the job queue (import-jobs.service.ts). */
export type ImportInBackground = (actor: Actor, signer: Signer, csv: string, total: number) => Promise<ImportJobView>;

const report = (dryRun: boolean, planned: PlannedRow[], written: ImportReport['written']): ImportReport => ({
  dryRun, ok: planned.every((p) => !p.problems.length), written,
  rows: planned.map((p) => ({ line: p.row.line, email: p.row.email, scope: p.row.scope, problems: p.problems })),
});

/**
 * People and their paper authorisations from a CSV file. The dry run lists every row's problems; the
 * real run checks again and writes every row in one transaction, or none of them (a large file: as a job).
 */
export function makeImportService(deps: Deps, signatures: Signatures) {
  const { db, clock } = deps;
  let background: ImportInBackground | null = null;

  /** Parses and checks; throws 422 naming every refused line. */
  async function checked(actor: Actor, ability: AppAbility, csv: string): Promise<PlannedRow[]> {
    const planned = await checkImport(db, actor, ability, parseImport(csv), clock.now());
    const bad = planned.filter((p) => p.problems.length);
    if (bad.length) {
      const fields = Object.fromEntries(bad.map((p) => [`line ${p.row.line}`, p.problems.join('; ')]));
      throw new AppError(422, 'import_refused', `Nothing was written: ${bad.length} row(s) have problems, the first on line ${bad[0].row.line} (${bad[0].problems[0]}).`, fields);
    }
    return planned;
  }

  async function run(actor: Actor, ability: AppAbility, body: ImportBody): Promise<ImportReport> {
    if (body.dryRun) return report(true, await checkImport(db, actor, ability, parseImport(body.csv), clock.now()), null);
    const planned = await checked(actor, ability, body.csv);
    if (!body.password) throw unprocessable('password: re-enter your password to sign the import', { password: 're-enter your password to sign the import' });
    const signer = await signatures.verify(actor.id, body.password);
    if (background && planned.length > LARGE_IMPORT_ROWS) return { ...report(false, planned, null), job: await background(actor, signer, body.csv, planned.length) };
    return report(false, planned, await writeImport(deps, signatures, actor, planned, signer));
  }

  return {
    run,
    checked,
    write: (actor: Actor, planned: PlannedRow[], signer: Signer, onRow?: () => void) => writeImport(deps, signatures, actor, planned, signer, onRow),
    useBackground(fn: ImportInBackground | null) {
      background = fn;
    },
  };
}
export type ImportService = ReturnType<typeof makeImportService>;
