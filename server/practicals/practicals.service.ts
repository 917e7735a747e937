import { ZodError } from 'zod';
import type { Deps } from '../deps.js';
import { subjectOf, type Actor, type AppAbility } from '../../shared/abilities.js';
import type { OpenPracticalBody, PracticalListQuery } from '../../shared/schemas/practicals.js';
import type { PracticalRowView } from '../../shared/practicals/views.js';
import { computeExpectations } from '../../shared/practicals/expectations.js';
import { EngineError } from '../../shared/engine/errors.js';
import { accessibleWhere } from '../authz/casl-sql.js';
import { AppError, forbidden, unprocessable } from '../errors.js';
import type { Signatures } from '../signatures/signatures.service.js';
import type { Usability } from '../benches/usability.service.js';
import { checklistInForce } from '../records/checklist.js';
import * as repo from './practicals.repository.js';
import { listPracticals } from './practicals.list.repository.js';
import { readablePractical } from './practicals.access.js';
import { checkAssessorStanding } from './assessor-standing.js';
import { practicalView } from './practicals.views.js';

export function makePracticalsService(deps: Deps, signatures: Signatures, usability: Usability) {
  const { db, clock, audit } = deps;

  async function technicianFor(actor: Actor, id: string) {
    if (id === actor.id) throw forbidden('An assessor never assesses themselves: another assessor runs your practical.');
    const person = await repo.personBrief(db, id);
    if (!person || !person.active || !person.roles.includes('technician')) throw unprocessable('technicianId: no such technician', { technicianId: 'not an active technician' });
    if (!actor.siteIds.includes(person.siteId)) throw forbidden(`You do not cover ${person.name}'s site.`);
    return person;
  }

  /** Opens a practical on a usable bench with usable instruments; the engine's expectations are stored with it. */
  async function open(actor: Actor, ability: AppAbility, body: OpenPracticalBody) {
    const technician = await technicianFor(actor, body.technicianId);
    const now = clock.now();
    await checkAssessorStanding(db, actor.id, body.scopeId, now);
    const { checklist } = await checklistInForce(db, body.procedureId, body.versionId, body.checklistId, ['practical-assessment']);
    const created = await db.transaction(async (tx) => {
      const { bench } = await usability.checkBenchUsable(body.benchId, now, tx);
      if (!ability.can('create', subjectOf('Practical', { siteId: bench.siteId, technicianId: technician.id }))) throw forbidden(`You do not cover the site of bench ${bench.code}.`);
      const { typeAcDecision } = await usability.checkBenchForPractical(bench, technician.siteId, body.crossSiteReason, tx);
      for (const id of body.instrumentIds) {
        const { instrument } = await usability.checkInstrumentUsable(id, now, bench.supplyVoltage, tx);
        if (instrument.siteId !== bench.siteId) throw unprocessable(`instrumentIds: instrument SN ${instrument.serial} belongs to another site`, { instrumentIds: `SN ${instrument.serial} belongs to another site` });
      }
      const expectations = expected(body.circuit, bench.supplyVoltage, bench.supplyFrequency);
      const row = await repo.insertPractical(tx, {
        technicianId: technician.id, assessorId: actor.id, siteId: bench.siteId, benchId: bench.id, procedureId: body.procedureId, versionId: body.versionId,
        checklistId: checklist.id, scopeId: body.scopeId, instrumentIds: [...new Set(body.instrumentIds)], circuit: body.circuit, expectations,
        status: 'in_progress', heldAt: now, createdAt: now, updatedAt: now,
        crossSiteReason: bench.siteId === technician.siteId ? null : body.crossSiteReason, typeAcDecisionId: typeAcDecision?.id ?? null,
      });
      await audit(tx, { actorId: actor.id, action: 'practical.opened', entity: 'practical', entityId: row.id, newValues: { ...body, expectations } });
      return row;
    });
    return practicalView(db, signatures, created);
  }

  async function list(actor: Actor, ability: AppAbility, q: PracticalListQuery) {
    const access = accessibleWhere(ability, 'read', 'Practical', repo.practicalAccessColumns);
    const { items, total } = await listPracticals(db, { ...q, access, mineId: q.view === 'mine' ? actor.id : undefined });
    const rows: PracticalRowView[] = items.map((r) => ({ ...r, status: r.status as PracticalRowView['status'], outcome: r.outcome as PracticalRowView['outcome'], heldAt: r.heldAt.toISOString() }));
    return { items: rows, total, page: q.page, pageSize: q.pageSize };
  }

  return {
    open,
    list,
    get: async (ability: AppAbility, id: string) => practicalView(db, signatures, await readablePractical(db, ability, id)),
    candidates: async (actor: Actor, q?: string) => ({ items: await repo.technicianCandidates(db, [...actor.siteIds], actor.id, q) }),
  };
}

/** The engine's refusal of a circuit is the caller's error, naming the field under `circuit`. */
function expected(circuit: OpenPracticalBody['circuit'], voltageRms: number, frequencyHz: number) {
  try {
    return computeExpectations(circuit, { voltageRms, frequencyHz });
  } catch (e) {
    if (e instanceof EngineError) throw new AppError(422, 'engine_input', `circuit.${e.field}: ${e.message}`, { [`circuit.${e.field}`]: e.message });
    // The engine's own input ranges: a rated load can work out beyond them (e.g. 10 MΩ and up).
    if (e instanceof ZodError) throw new AppError(422, 'engine_input', `circuit.load: ${e.issues[0]?.message ?? 'outside what the engine computes'}`, { 'circuit.load': 'outside what the engine computes' });
    throw e;
  }
}
export type PracticalsService = ReturnType<typeof makePracticalsService>;
