import type { Deps } from '../deps.js';
import type { Actor } from '../../shared/abilities.js';
import { CERTIFICATE_KIND_LABELS, PENDING_REQUIREMENT_KINDS, REQUIREMENT_KIND_LABELS, type CertificateKind } from '../../shared/authorisations/kinds.js';
import type { RequirementBody, ScopeBody } from '../../shared/schemas/authorisations.js';
import type { ScopeView } from '../../shared/authorisations/views.js';
import { conflict, notFound, unprocessable } from '../errors.js';
import * as repo from './scopes.repository.js';
import { presentRequirement } from './present.js';

type Accepted = Exclude<RequirementBody, { kind: (typeof PENDING_REQUIREMENT_KINDS)[number] }>;

export function makeScopesService({ db, clock, audit }: Deps) {
  async function views(rows: repo.ScopeWithRequirements[], all?: repo.ScopeWithRequirements[]): Promise<ScopeView[]> {
    const titles = new Map((all ?? (await repo.scopesWithRequirements(db))).map((s) => [s.id, s.title]));
    const procs = await repo.procedureNames(db, rows.flatMap((s) => s.requirements.map((r) => r.procedureId).filter((p): p is string => !!p)));
    const label = (r: repo.RequirementRow) => {
      if (r.kind === 'prerequisite') return `Holds “${titles.get(r.prerequisiteScopeId!) ?? 'another scope'}”`;
      if (r.kind === 'certificate') return `Current ${CERTIFICATE_KIND_LABELS[r.certificateKind as CertificateKind] ?? r.certificateKind} certificate`;
      if (r.kind === 'procedure_ack') {
        const p = procs.get(r.procedureId!);
        return p ? `Acknowledged ${p.code} “${p.title}” (version in force)` : 'Acknowledged a procedure (version in force)';
      }
      return REQUIREMENT_KIND_LABELS[r.kind as keyof typeof REQUIREMENT_KIND_LABELS] ?? r.kind;
    };
    return rows.map(({ requirements, createdBy: _c, createdAt: _a, updatedAt: _u, ...s }) => ({ ...s, requirements: requirements.map((r) => presentRequirement(r, label(r))) }));
  }

  async function list() {
    const all = await repo.scopesWithRequirements(db);
    return views(all, all);
  }

  async function get(id: string) {
    const [row] = await repo.scopesWithRequirements(db, [id]);
    if (!row) throw notFound('That scope');
    return (await views([row]))[0];
  }

  /** Refuses kinds not recorded yet, unknown references, repeats and prerequisite loops, naming the requirement. */
  async function checkRequirements(scopeId: string | null, reqs: RequirementBody[]): Promise<Accepted[]> {
    const all = await repo.scopesWithRequirements(db);
    const seen = new Set<string>();
    reqs.forEach((r, i) => {
      const at = `requirements.${i}`;
      if ((PENDING_REQUIREMENT_KINDS as readonly string[]).includes(r.kind)) {
        throw unprocessable(`${at}.kind: ${REQUIREMENT_KIND_LABELS[r.kind].toLowerCase()} cannot be required yet: the portal does not record them yet`, { [`${at}.kind`]: 'not recorded by the portal yet' });
      }
      const a = r as Accepted;
      const key = a.kind === 'prerequisite' ? `p:${a.scopeId}` : a.kind === 'certificate' ? `c:${a.certificateKind}` : `a:${a.procedureId}`;
      if (seen.has(key)) throw unprocessable(`${at}: listed twice`, { [at]: 'listed twice' });
      seen.add(key);
      if (a.kind === 'prerequisite' && !all.some((s) => s.id === a.scopeId)) throw unprocessable(`${at}.scopeId: no such scope`, { [`${at}.scopeId`]: 'no such scope' });
      if (a.kind === 'prerequisite' && a.scopeId === scopeId) throw unprocessable(`${at}.scopeId: a scope cannot rest on itself`, { [`${at}.scopeId`]: 'a scope cannot rest on itself' });
    });
    const accepted = reqs as Accepted[];
    if (!accepted.some((r) => r.kind !== 'prerequisite')) {
      throw unprocessable('requirements: list at least one requirement besides other scopes (a certificate or a procedure)', { requirements: 'list at least one requirement besides other scopes' });
    }
    const procIds = [...new Set(accepted.flatMap((r) => (r.kind === 'procedure_ack' ? [r.procedureId] : [])))];
    if ((await repo.countProcedures(db, procIds)) !== procIds.length) {
      const i = accepted.findIndex((r) => r.kind === 'procedure_ack');
      throw unprocessable(`requirements.${i}.procedureId: no such procedure`, { [`requirements.${i}.procedureId`]: 'no such procedure' });
    }
    if (scopeId && loops(scopeId, accepted, all)) throw unprocessable('requirements: these prerequisites would make a loop back to this scope', { requirements: 'prerequisites would loop back to this scope' });
    return accepted;
  }

  function rows(reqs: Accepted[]) {
    return reqs.map((r) => ({
      kind: r.kind,
      procedureId: r.kind === 'procedure_ack' ? r.procedureId : null,
      prerequisiteScopeId: r.kind === 'prerequisite' ? r.scopeId : null,
      certificateKind: r.kind === 'certificate' ? r.certificateKind : null,
    }));
  }

  async function create(actor: Actor, body: ScopeBody) {
    if (await repo.findScopeByCode(db, body.code)) throw conflict('code: a scope with this code exists', { code: 'already in use' });
    const reqs = await checkRequirements(null, body.requirements);
    const now = clock.now();
    const { requirements: _r, ...fields } = body;
    const created = await db.transaction(async (tx) => {
      const scope = await repo.insertScope(tx, { ...fields, createdBy: actor.id, createdAt: now, updatedAt: now });
      await repo.replaceRequirements(tx, scope.id, rows(reqs));
      await audit(tx, { actorId: actor.id, action: 'scope.created', entity: 'scope', entityId: scope.id, newValues: body });
      return scope;
    });
    return get(created.id);
  }

  async function update(actor: Actor, id: string, body: ScopeBody) {
    const before = await get(id);
    const other = await repo.findScopeByCode(db, body.code);
    if (other && other.id !== id) throw conflict('code: a scope with this code exists', { code: 'already in use' });
    const reqs = await checkRequirements(id, body.requirements);
    const { requirements: _r, ...fields } = body;
    await db.transaction(async (tx) => {
      if (!(await repo.lockScope(tx, id))) throw notFound('That scope');
      await repo.updateScope(tx, id, { ...fields, updatedAt: clock.now() });
      await repo.replaceRequirements(tx, id, rows(reqs));
      await audit(tx, { actorId: actor.id, action: 'scope.updated', entity: 'scope', entityId: id, oldValues: before, newValues: body });
    });
    return get(id);
  }

  return { list, get, create, update };
}

/** True when following prerequisites from the new list leads back to the scope being saved. */
function loops(scopeId: string, reqs: Accepted[], all: repo.ScopeWithRequirements[]): boolean {
  const byId = new Map(all.map((s) => [s.id, s]));
  const stack = reqs.flatMap((r) => (r.kind === 'prerequisite' ? [r.scopeId] : []));
  const seen = new Set<string>();
  while (stack.length) {
    const next = stack.pop()!;
    if (next === scopeId) return true;
    if (seen.has(next)) continue;
    seen.add(next);
    for (const r of byId.get(next)?.requirements ?? []) if (r.prerequisiteScopeId) stack.push(r.prerequisiteScopeId);
  }
  return false;
}
