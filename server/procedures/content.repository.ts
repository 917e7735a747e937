import { asc, eq, inArray } from 'drizzle-orm';
import type { Executor } from '../db/client.js';
import { checklistItems, procedureChecklists, procedureSteps } from '../db/schema/index.js';
import type { AcceptanceRule } from '../../shared/schemas/checklists.js';

export interface StoredStep {
  key: string;
  text: string;
  caution: string | null;
  holdPoint: boolean;
}
export interface StoredItem {
  key: string;
  kind: string;
  prompt: string;
  guidance: string | null;
  unit: string | null;
  rule: AcceptanceRule | null;
  /** The step of the same version the item belongs to. */
  stepKey: string | null;
}
export interface StoredChecklist {
  id?: string;
  key: string;
  kind: string;
  title: string;
  items: (StoredItem & { id?: string })[];
}
export interface VersionContent {
  steps: StoredStep[];
  checklists: StoredChecklist[];
}

export async function loadSteps(db: Executor, versionId: string): Promise<StoredStep[]> {
  return db
    .select({ key: procedureSteps.key, text: procedureSteps.text, caution: procedureSteps.caution, holdPoint: procedureSteps.holdPoint })
    .from(procedureSteps)
    .where(eq(procedureSteps.versionId, versionId))
    .orderBy(asc(procedureSteps.position));
}

/** Checklists with their items in two queries, however many checklists there are. */
export async function loadChecklists(db: Executor, versionId: string): Promise<StoredChecklist[]> {
  const lists = await db.select().from(procedureChecklists).where(eq(procedureChecklists.versionId, versionId)).orderBy(asc(procedureChecklists.position));
  if (!lists.length) return [];
  const items = await db
    .select()
    .from(checklistItems)
    .where(inArray(checklistItems.checklistId, lists.map((l) => l.id)))
    .orderBy(asc(checklistItems.checklistId), asc(checklistItems.position));
  return lists.map((l) => ({
    id: l.id, key: l.key, kind: l.kind, title: l.title,
    items: items.filter((i) => i.checklistId === l.id).map((i) => ({
      id: i.id, key: i.key, kind: i.kind, prompt: i.prompt, guidance: i.guidance, unit: i.unit, rule: (i.rule as AcceptanceRule | null) ?? null, stepKey: i.stepKey,
    })),
  }));
}

export async function loadContent(db: Executor, versionId: string): Promise<VersionContent> {
  const [steps, checklists] = await Promise.all([loadSteps(db, versionId), loadChecklists(db, versionId)]);
  return { steps, checklists };
}

/** Replaces a draft's steps and checklists wholesale (the database refuses this for any other state). */
export async function replaceContent(tx: Executor, versionId: string, content: VersionContent) {
  await tx.delete(procedureSteps).where(eq(procedureSteps.versionId, versionId));
  await tx.delete(procedureChecklists).where(eq(procedureChecklists.versionId, versionId));
  if (content.steps.length) {
    await tx.insert(procedureSteps).values(content.steps.map((s, position) => ({ versionId, position, ...s })));
  }
  if (!content.checklists.length) return;
  const lists = await tx
    .insert(procedureChecklists)
    .values(content.checklists.map((c, position) => ({ versionId, position, key: c.key, kind: c.kind, title: c.title })))
    .returning({ id: procedureChecklists.id, key: procedureChecklists.key });
  const idByKey = new Map(lists.map((l) => [l.key, l.id]));
  const rows = content.checklists.flatMap((c) =>
    c.items.map((i, position) => ({
      checklistId: idByKey.get(c.key)!, position, key: i.key, kind: i.kind, prompt: i.prompt, guidance: i.guidance, unit: i.unit, rule: i.rule, stepKey: i.stepKey,
    })),
  );
  if (rows.length) await tx.insert(checklistItems).values(rows);
}
