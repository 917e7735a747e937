import { appendFileSync } from 'node:fs';
import path from 'node:path';
import { makeSealer, type SealOptions } from '../../server/audit/sealer.js';
import { ANCHOR_FILE } from '../../server/audit/anchor.js';
import type { ChainReportView } from '../../shared/register/views.js';
import type { TestApp } from './app.js';
import { DEMO, signIn } from './people.js';

/** A sealer of the test app's own (like another server process's): seals now, waiting briefly for open writers. */
export const seal = (t: TestApp, opts: SealOptions = {}, key = t.config.audit.key) =>
  makeSealer({ ...t.deps, config: { ...t.config, audit: { ...t.config.audit, key } } }).run({ waitMs: 300, ...opts });

const auditors = new WeakMap<TestApp, Awaited<ReturnType<typeof signIn>>>();

/** The chain check as an auditor sees it (POST /api/audit/verify); one sign-in per app, so one entry. */
export async function verify(t: TestApp): Promise<ChainReportView> {
  if (!auditors.has(t)) auditors.set(t, await signIn(t, DEMO.auditor));
  const auditor = auditors.get(t)!;
  const res = await auditor.post('/api/audit/verify');
  if (res.status !== 200) throw new Error(`verify answered ${res.status}`);
  return res.body as ChainReportView;
}

/** Runs SQL as the database owner with the append-only triggers off: what only a superuser could do. */
export async function tamper(t: TestApp, statements: string) {
  await t.ownerQuery(`begin;
    alter table audit_log disable trigger user; alter table audit_seal disable trigger user;
    ${statements};
    alter table audit_log enable trigger user; alter table audit_seal enable trigger user;
    commit;`);
}

/** Entry ids in order, and the newest sealed one. */
export async function ids(t: TestApp): Promise<number[]> {
  return (await t.ownerQuery('select id from audit_log order by id')).rows.map((r) => Number(r.id));
}

export const appendAnchorLine = (t: TestApp, line: string) => appendFileSync(path.join(t.config.audit.anchorDir, ANCHOR_FILE), `${line}\n`);

/** One small audited change in its own transaction; resolves once committed. */
export const smallWrite = (t: TestApp, entityId: string) =>
  t.deps.db.transaction((tx) => t.deps.audit(tx, { actorId: null, action: 'test.small', entity: 'test', entityId, newValues: { entityId } }));
