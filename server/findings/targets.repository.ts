import { sql, type SQL } from 'drizzle-orm';
import type { Executor } from '../db/client.js';
import type { FindingTarget } from '../../shared/register/kinds.js';
import { rowsOf } from '../register/rows.js';

export interface Target {
  siteId: string | null;
  label: string;
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

// One lookup per record kind: does it exist, whose site is it, and how to name it on the finding.
const LOOKUPS: Record<Exclude<FindingTarget, 'audit_entry'>, (id: string) => SQL> = {
  person: (id) => sql`select u.site_id, 'Person: ' || u.name as label from users u where u.id = ${id}`,
  authorisation: (id) => sql`select u.site_id, 'Authorisation ' || s.code || ' held by ' || u.name as label
    from authorisations a join users u on u.id = a.holder_id join scopes s on s.id = a.scope_id where a.id = ${id}`,
  procedure_version: (id) => sql`select p.site_id, 'Procedure ' || p.code || ' version ' || v.number as label
    from procedure_versions v join procedures p on p.id = v.procedure_id where v.id = ${id}`,
  practical: (id) => sql`select x.site_id, 'Practical of ' || u.name || ' on bench ' || b.code as label
    from practicals x join users u on u.id = x.technician_id join benches b on b.id = x.bench_id where x.id = ${id}`,
  signoff: (id) => sql`select x.site_id, 'Sign-off by ' || u.name || ' on ' || p.code as label
    from signoffs x join users u on u.id = x.person_id join procedures p on p.id = x.procedure_id where x.id = ${id}`,
  bench: (id) => sql`select b.site_id, 'Bench ' || b.code as label from benches b where b.id = ${id}`,
  bench_check: (id) => sql`select b.site_id, 'Pre-use check of bench ' || b.code || ' by ' || u.name as label
    from bench_checks c join benches b on b.id = c.bench_id join users u on u.id = c.person_id where c.id = ${id}`,
  instrument: (id) => sql`select i.site_id, 'Instrument ' || i.make || ' ' || i.model || ' SN ' || i.serial as label from instruments i where i.id = ${id}`,
  certificate: (id) => sql`select u.site_id, 'Certificate ' || c.kind || ' of ' || u.name as label
    from external_certificates c join users u on u.id = c.holder_id where c.id = ${id}`,
  evidence: (id) => sql`select e.site_id, 'Evidence file ' || e.file_name as label from evidence e where e.id = ${id}`,
};

/** The record a finding is about, or undefined when there is no such record. */
export async function findTarget(db: Executor, entity: FindingTarget, id: string): Promise<Target | undefined> {
  if (entity === 'audit_entry') {
    if (!/^\d{1,18}$/.test(id)) return undefined;
    const [row] = await rowsOf(db, sql`select null as site_id, 'Audit trail entry #' || l.id || ' (' || l.action || ')' as label from audit_log l where l.id = ${id}::bigint`);
    return toTarget(row);
  }
  if (!UUID.test(id)) return undefined;
  const [row] = await rowsOf(db, LOOKUPS[entity](id));
  return toTarget(row);
}

const toTarget = (r: unknown): Target | undefined => (r ? { siteId: (r as { site_id: string | null }).site_id, label: (r as { label: string }).label } : undefined);
