import type { Deps } from '../deps.js';
import { subjectOf, type Actor, type AppAbility } from '../../shared/abilities.js';
import type { TypeAcDecisionBody } from '../../shared/schemas/bench-decisions.js';
import { forbidden, notFound, unprocessable } from '../errors.js';
import { findBench, lockBench } from './benches.repository.js';
import { insertTypeAcDecision, typeAcDecision, typeAcDecisionsOf } from './type-ac.repository.js';

/**
 * A bench with a Type AC RCD is refused for practicals (a phase-cut load can blind it) unless a manager
 * of its site records why it is safe anyway. Decisions are never edited; the newest one stands.
 */
export function makeTypeAcDecisions(deps: Deps) {
  const { db, clock, audit } = deps;

  async function benchFor(ability: AppAbility, id: string, action: 'read' | 'update') {
    const view = await findBench(db, id);
    if (!view) throw notFound('That bench');
    if (!ability.can(action, subjectOf('Bench', view.bench))) throw forbidden(action === 'read' ? 'You may not see this bench.' : 'Only a manager of the bench’s site records this decision.');
    return view.bench;
  }

  async function record(actor: Actor, ability: AppAbility, benchId: string, body: TypeAcDecisionBody) {
    const bench = await benchFor(ability, benchId, 'update');
    if (bench.rcdType !== 'AC') throw unprocessable(`rcdType: bench ${bench.code} has no Type AC RCD; there is nothing to accept`, { rcdType: 'not Type AC: nothing to accept' });
    const id = await db.transaction(async (tx) => {
      await lockBench(tx, benchId);
      const row = await insertTypeAcDecision(tx, { benchId, decidedBy: actor.id, decidedAt: clock.now(), reason: body.reason });
      await audit(tx, { actorId: actor.id, action: 'bench.type_ac_accepted', entity: 'bench', entityId: benchId, newValues: { decisionId: row.id, reason: body.reason } });
      return row.id;
    });
    return (await typeAcDecision(db, id))!;
  }

  async function list(ability: AppAbility, benchId: string) {
    await benchFor(ability, benchId, 'read');
    return { items: await typeAcDecisionsOf(db, benchId) };
  }

  return { record, list };
}
export type TypeAcDecisions = ReturnType<typeof makeTypeAcDecisions>;
