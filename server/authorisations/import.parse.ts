import { parse } from 'csv-parse/sync';
import { unprocessable } from '../errors.js';
import { cleanText } from '../../shared/schemas/text.js';

export const IMPORT_COLUMNS = ['email', 'name', 'site', 'roles', 'scope', 'issued_on', 'expires_on', 'attested_by', 'note'] as const;
const REQUIRED = ['email', 'name', 'site', 'scope', 'issued_on', 'expires_on', 'attested_by'] as const;

export type ImportRow = Record<(typeof IMPORT_COLUMNS)[number], string> & { line: number };

/** The file's rows with the line each starts on; a file that is not CSV, or lacks a column, is refused whole. */
export function parseImport(csv: string): ImportRow[] {
  let parsed: { record: Record<string, string>; info: { lines: number } }[];
  try {
    parsed = parse(csv, { columns: (h: string[]) => h.map((c) => c.trim().toLowerCase()), skip_empty_lines: true, trim: true, bom: true, info: true });
  } catch (err) {
    throw unprocessable(`csv: ${(err as Error).message}`, { csv: (err as Error).message });
  }
  if (!parsed.length) throw unprocessable('csv: the file has a header but no rows', { csv: 'no rows' });
  const header = Object.keys(parsed[0].record);
  const missing = REQUIRED.filter((c) => !header.includes(c));
  if (missing.length) throw unprocessable(`csv: missing column(s) ${missing.join(', ')}`, { csv: `missing column(s) ${missing.join(', ')}; expected ${IMPORT_COLUMNS.join(', ')}` });
  const unknown = header.filter((c) => !(IMPORT_COLUMNS as readonly string[]).includes(c));
  if (unknown.length) throw unprocessable(`csv: unknown column(s) ${unknown.join(', ')}`, { csv: `unknown column(s) ${unknown.join(', ')}` });
  if (parsed.length > 2000) throw unprocessable('csv: at most 2000 rows per file', { csv: 'at most 2000 rows per file' });
  return parsed.map(({ record, info }) => {
    const row = Object.fromEntries(IMPORT_COLUMNS.map((c) => [c, cleanText(record[c] ?? '')])) as unknown as ImportRow;
    row.email = row.email.toLowerCase();
    row.scope = row.scope.toUpperCase();
    row.line = info.lines;
    return row;
  });
}
