import type { Deps } from '../deps.js';
import { subjectOf, type Actor, type AppAbility } from '../../shared/abilities.js';
import { benchSetupProblems, type BenchBody, type BenchesQuery, type BenchUpdateBody, type PreUseCheckBody } from '../../shared/schemas/benches.js';
import { DUE_SOON_DAYS } from '../../shared/equipment.js';
import { accessibleWhere } from '../authz/casl-sql.js';
import { conflict, forbidden, notFound, unprocessable } from '../errors.js';
import { presentSignature, type Signatures } from '../signatures/signatures.service.js';
import { countSites } from '../sites/sites.repository.js';
import * as repo from './benches.repository.js';
import { presentBench, presentCheck } from './equipment.present.js';
import type { Usability } from './usability.service.js';
import { makeTypeAcDecisions } from './type-ac.service.js';
import { typeAcDecisionsOf } from './type-ac.repository.js';

export const PRE_USE_CHECK_MEANING = 'pre-use check carried out as recorded';

export function makeBenchesService(deps: Deps, signatures: Signatures, usability: Usability) {
  const { db, clock, audit } = deps;

  async function load(ability: AppAbility, id: string, action: 'read' | 'update' = 'read') {
    const view = await repo.findBench(db, id);
    if (!view) throw notFound('That bench');
    if (!ability.can(action, subjectOf('Bench', view.bench))) throw forbidden(action === 'read' ? 'You may not see this bench.' : 'You may not change benches at this site.');
    return view;
  }

  async function list(ability: AppAbility, q: BenchesQuery) {
    const access = accessibleWhere(ability, 'read', 'Bench', repo.benchAccessColumns);
    const now = clock.now();
    const active = q.active === undefined ? undefined : q.active === 'true';
    const { items, total } = await repo.listBenches(db, { ...q, active, access, now, dueSoonDays: DUE_SOON_DAYS });
    return { items: items.map((v) => presentBench(v, now)), total, page: q.page, pageSize: q.pageSize };
  }

  async function create(actor: Actor, ability: AppAbility, body: BenchBody) {
    if (!ability.can('create', subjectOf('Bench', { siteId: body.siteId }))) throw forbidden('You may not add benches at that site.');
    if ((await countSites(db, [body.siteId])) !== 1) throw unprocessable('siteId: no such site', { siteId: 'no such site' });
    if (await repo.findBenchByCode(db, body.siteId, body.code)) throw conflict('code: a bench with this code exists at that site', { code: 'already in use at this site' });
    const now = clock.now();
    const created = await db.transaction(async (tx) => {
      const b = await repo.insertBench(tx, { ...body, createdAt: now, updatedAt: now });
      await audit(tx, { actorId: actor.id, action: 'bench.created', entity: 'bench', entityId: b.id, newValues: body });
      return b;
    });
    return presentBench((await repo.findBench(db, created.id))!, now);
  }

  async function update(actor: Actor, ability: AppAbility, id: string, body: BenchUpdateBody) {
    const before = await load(ability, id, 'update');
    const problems = benchSetupProblems({ ...before.bench, ...body });
    if (Object.keys(problems).length) throw unprocessable(Object.entries(problems).map(([k, v]) => `${k}: ${v}`).join('; '), problems);
    if (body.code && body.code !== before.bench.code && (await repo.findBenchByCode(db, before.bench.siteId, body.code))) {
      throw conflict('code: a bench with this code exists at that site', { code: 'already in use at this site' });
    }
    const now = clock.now();
    const old = Object.fromEntries(Object.keys(body).map((k) => [k, before.bench[k as keyof typeof before.bench]]));
    await db.transaction(async (tx) => {
      await repo.lockBench(tx, id);
      await repo.updateBench(tx, id, { ...body, updatedAt: now });
      await audit(tx, { actorId: actor.id, action: 'bench.updated', entity: 'bench', entityId: id, oldValues: old, newValues: body });
    });
    return presentBench((await repo.findBench(db, id))!, now);
  }

  async function listChecks(ability: AppAbility, id: string, page: number, pageSize: number) {
    const view = await load(ability, id);
    if (!ability.can('read', subjectOf('BenchCheck', { siteId: view.bench.siteId }))) throw forbidden('You may not see the checks of this bench.');
    const { items, total } = await repo.listChecks(db, id, page, pageSize);
    const signed = await signatures.list(db, 'bench_check', items.map((r) => r.check.id));
    const signatureOf = (checkId: string) => signed.filter((s) => s.entityId === checkId).map(presentSignature);
    return { items: items.map((r) => ({ ...presentCheck(r.check, r.personName), signatures: signatureOf(r.check.id) })), total, page, pageSize };
  }

  /** A simple signed pass/fail check; the checklist-driven check will link its response through checklistResponseId. */
  async function recordCheck(actor: Actor, ability: AppAbility, id: string, body: PreUseCheckBody) {
    const view = await load(ability, id);
    if (!ability.can('create', subjectOf('BenchCheck', { siteId: view.bench.siteId }))) throw forbidden('You may not record checks on this bench.');
    if (!view.bench.active) throw conflict(`bench ${view.bench.code} is out of service`, { benchId: 'out of service' });
    const signer = await signatures.verify(actor.id, body.password);
    const check = await db.transaction(async (tx) => {
      const c = await repo.insertCheck(tx, { benchId: id, personId: actor.id, at: clock.now(), passed: body.passed, notes: body.notes, checklistResponseId: null });
      await audit(tx, { actorId: actor.id, action: 'bench.pre_use_check', entity: 'bench_check', entityId: c.id, newValues: { benchId: id, passed: c.passed, notes: c.notes } });
      const signature = await signatures.record(tx, signer, { meaning: PRE_USE_CHECK_MEANING, entity: 'bench_check', entityId: c.id });
      return { c, signature };
    });
    return { ...presentCheck(check.c, signer.printedName), signatures: [presentSignature(check.signature)] };
  }

  async function usabilityOf(ability: AppAbility, id: string) {
    const view = await load(ability, id);
    const usable = await usability.checkBenchUsable(id, clock.now());
    // A Type AC bench is refused for practicals unless this decision stands.
    const typeAcDecision = view.bench.rcdType === 'AC' ? ((await typeAcDecisionsOf(db, id))[0] ?? null) : null;
    return { ...usable, typeAcDecision };
  }

  return { typeAc: makeTypeAcDecisions(deps), list, get: async (ability: AppAbility, id: string) => presentBench(await load(ability, id), clock.now()), create, update, listChecks, recordCheck, usabilityOf };
}
