import type { Executor } from '../db/client.js';
import { conflict } from '../errors.js';
import { loadSteps } from '../procedures/content.repository.js';
import * as repo from './practicals.repository.js';

/**
 * A hold point holds: nothing that belongs to a later step may be recorded while an earlier hold point is
 * open. Items linked to no step (versions written before links existed) are not held back.
 */
export async function refuseUnlessStepOpen(tx: Executor, practicalId: string, versionId: string, stepKey: string | null) {
  if (!stepKey) return;
  const steps = await loadSteps(tx, versionId);
  const at = steps.findIndex((s) => s.key === stepKey);
  if (at < 0) return;
  const done = new Set((await repo.witnessedOf(tx, practicalId)).map((w) => w.stepKey));
  const holds = steps.map((s, position) => ({ ...s, position })).filter((s) => s.holdPoint);
  const open = holds.find((h) => h.position < at && !done.has(h.key));
  if (!open) return;
  const n = holds.indexOf(open) + 1;
  const why = `hold point ${n} (step ${open.position + 1}: "${open.text}") is not witnessed yet`;
  throw conflict(`Step ${at + 1} cannot be recorded yet: ${why}. Witness it first.`, { itemId: why });
}
