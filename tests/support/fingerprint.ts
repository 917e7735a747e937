import type { TestApp } from './app.js';

// Written on purpose by a refusal or by work that finishes after an earlier answer, so not compared:
// sessions (touched on every request), the sign-in rate window and a person's wrong-password count
// (a wrong password is counted by design), and mail delivery state (delivered after commit).
const SKIPPED_TABLES = ['session', 'signin_rate_limit', 'audit_seal', '__drizzle_migrations'];
const SKIPPED_COLUMNS: Record<string, string[]> = {
  users: ['failed_sign_ins', 'locked_until'],
  mail_log: ['status', 'attempts', 'next_attempt_at', 'sent_at', 'error', 'file_name', 'locked_at', 'updated_at'],
};

let query: string | null = null;

type Run = (text: string) => Promise<{ rows: unknown[] }>;

/**
 * One checksum over every business table (rows and values), read as the owner. Equal before and after =
 * nothing written. `run` may be a kept owner connection's query (many fingerprints in one test).
 */
export async function fingerprint(t: TestApp, run: Run = (q) => t.ownerQuery(q)): Promise<Record<string, string>> {
  if (!query) {
    const { rows } = await run(`select table_name from information_schema.tables where table_schema = 'public' and table_type = 'BASE TABLE' order by 1`);
    query = (rows as { table_name: string }[]).map((r) => r.table_name).filter((n) => !SKIPPED_TABLES.includes(n)).map((n) => {
      const drop = (SKIPPED_COLUMNS[n] ?? []).map((c) => ` - '${c}'`).join('');
      return `select '${n}' as t, count(*)::text || ':' || coalesce(md5(string_agg((to_jsonb(x)${drop})::text, '|' order by (to_jsonb(x)${drop})::text)), '') as f from "${n}" x`;
    }).join(' union all ');
  }
  const { rows } = await run(query);
  return Object.fromEntries((rows as { t: string; f: string }[]).map((r) => [r.t, r.f]));
}

/** The tables whose fingerprints differ. */
export const changedTables = (before: Record<string, string>, after: Record<string, string>) =>
  Object.keys({ ...before, ...after }).filter((k) => before[k] !== after[k]);
