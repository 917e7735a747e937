import { stringify as stringifyStream, type Options, type Stringifier } from 'csv-stringify';
import { stringify as stringifySync } from 'csv-stringify/sync';

// A spreadsheet runs a cell that starts with one of these as a formula (=HYPERLINK(…), +cmd|…, @SUM(…)).
const FORMULA_START = /^[=+\-@\t\r]/;

/** Text for a CSV cell that a spreadsheet shows as text: a leading quote before a formula-like start. */
export const safeCell = (v: string): string => (FORMULA_START.test(v) ? `'${v}` : v);

// Numbers stay numbers (a negative reading is not a formula); only text cells are guarded.
const guarded = (options: Options = {}): Options => ({ ...options, cast: { ...options.cast, string: safeCell } });

/** Every CSV export goes through these two, so no cell reaches a spreadsheet as a formula. */
export const csvStream = (options?: Options): Stringifier => stringifyStream(guarded(options));
export const csvText = (rows: unknown[][], options?: Options): string => stringifySync(rows, guarded(options));
