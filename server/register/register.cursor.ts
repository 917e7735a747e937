import { sql } from 'drizzle-orm';
import type { Executor } from '../db/client.js';
import type { RegisterSort } from '../../shared/register/kinds.js';
import { registerSelect, toRow, type RegisterRowData, type RegisterWhere } from './register.repository.js';
import { rowsOf } from './rows.js';

/**
 * Reads the whole register through one server-side cursor inside the caller's transaction: one query, one
 * consistent snapshot, handed over a batch at a time so an export never holds every row in memory.
 */
export async function eachRegisterBatch(tx: Executor, f: RegisterWhere, sort: RegisterSort, dir: 'asc' | 'desc', onBatch: (rows: RegisterRowData[]) => Promise<void>, size = 1000) {
  await tx.execute(sql`declare register_export no scroll cursor for ${registerSelect(f, sort, dir)}`);
  for (;;) {
    const rows = await rowsOf<Parameters<typeof toRow>[0]>(tx, sql.raw(`fetch forward ${size} from register_export`));
    if (!rows.length) break;
    await onBatch(rows.map(toRow));
  }
  await tx.execute(sql`close register_export`);
}
