import type { Deps } from '../deps.js';
import type { Actor } from '../../shared/abilities.js';
import { CERTIFICATE_KIND_LABELS, REQUIREMENT_KIND_LABELS, type CertificateKind } from '../../shared/authorisations/kinds.js';
import type { RequirementBody, ScopeBody } from '../../shared/schemas/authorisations.js';
import type { ScopeView } from '../../shared/authorisations/views.js';
import { conflict, notFound, unprocessable } from '../errors.js';
import * as repo from './scopes.repository.js';
import { presentRequirement } from './present.js';


export function makeScopesService({ db, clock, audit }: Deps) {
  async function views(rows: repo.ScopeWithRequirements[], all?: repo.ScopeWithRequirements[]): Promise<ScopeView[]> {
    const titles = new Map((all ?? (await repo.scopesWithRequirements(db))).map((s) => [s.id, s.title]));
    const procs = await repo.procedureNames(db, rows.flatMap((s) => s.requirements.map((r) => r.procedureId).filter((p): p is string => !!p)));
    const label = (r: repo.RequirementRow) => {
      if (r.kind === 'prerequisite') return `Holds “${titles.get(r.prerequisiteScopeId!) ?? 'another scope'}”`;
      if (r.kind === 'certificate') return `Current ${CERTIFICATE_KIND_LABELS[r.certificateKind as CertificateKind] ?? r.certificateKind} certificate`;
      const p = r.procedureId ? procs.get(r.procedureId) : undefined;
      const proc = p ? `${p.code} “${p.title}”` : 'a procedure';
      if (r.kind === 'procedure_ack') return `Acknowledged ${proc} (version in force)`;
      if (r.kind === 'checklist_signoff') return `Self sign-off of ${proc} countersigned`;
      if (r.kind === 'practicals') return `${r.practicalsCount} competent supervised practical${r.practicalsCount === 1 ? '' : 's'} on ${proc} within ${r.practicalsWindowMonths} months`;
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

  /** Refuses unknown references, repeats and prerequisite loops, naming the requirement. */
  async function checkRequirements(scopeId: string | null, reqs: RequirementBody[]): Promise<RequirementBody[]> {
    const all = await repo.scopesWithRequirements(db);
    const seen = new Set<string>();
    reqs.forEach((a, i) => {
      const at = `requirements.${i}`;
      const key = a.kind === 'prerequisite' ? `p:${a.scopeId}` : a.kind === 'certificate' ? `c:${a.certificateKind}` : `${a.kind}:${a.procedureId}`;
      if (seen.has(key)) throw unprocessable(`${at}: listed twice`, { [at]: 'listed twice' });
      seen.add(key);
      if (a.kind === 'prerequisite' && !all.some((s) => s.id === a.scopeId)) throw unprocessable(`${at}.scopeId: no such scope`, { [`${at}.scopeId`]: 'no such scope' });
      if (a.kind === 'prerequisite' && a.scopeId === scopeId) throw unprocessable(`${at}.scopeId: a scope cannot rest on itself`, { [`${at}.scopeId`]: 'a scope cannot rest on itself' });
    });
    const accepted = reqs;
    if (!accepted.some((r) => r.kind !== 'prerequisite')) {
      throw unprocessable('requirements: list at least one requirement besides other scopes (a certificate or a procedure)', { requirements: 'list at least one requirement besides other scopes' });
    }
    const procIds = [...new Set(accepted.flatMap((r) => ('procedureId' in r ? [r.procedureId] : [])))];
    const known = await repo.existingProcedures(db, procIds);
    const i = accepted.findIndex((r) => 'procedureId' in r && !known.has(r.procedureId));
    if (i >= 0) throw unprocessable(`requirements.${i}.procedureId: no such procedure`, { [`requirements.${i}.procedureId`]: 'no such procedure' });
    if (scopeId && loops(scopeId, accepted, all)) throw unprocessable('requirements: these prerequisites would make a loop back to this scope', { requirements: 'prerequisites would loop back to this scope' });
    return accepted;
  }

  function rows(reqs: RequirementBody[]) {
    return reqs.map((r) => ({
      kind: r.kind,
      procedureId: 'procedureId' in r ? r.procedureId : null,
      prerequisiteScopeId: r.kind === 'prerequisite' ? r.scopeId : null,
      certificateKind: r.kind === 'certificate' ? r.certificateKind : null,
      practicalsCount: r.kind === 'practicals' ? r.count : null,
      practicalsWindowMonths: r.kind === 'practicals' ? r.windowMonths : null,
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
function loops(scopeId: string, reqs: RequirementBody[], all: repo.ScopeWithRequirements[]): boolean {
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
