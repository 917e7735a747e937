import { randomUUID } from 'node:crypto';
import type { SeedStep } from './index.js';
import { checklistSchema, COMPUTED_NEEDS_PRACTICAL, computedRuleOutsidePractical } from '../../shared/schemas/checklists.js';
import { APPROVAL_MEANING, ACKNOWLEDGEMENT_MEANING } from '../../shared/schemas/procedures.js';
import { addDays, addMonths } from '../../shared/procedures/dates.js';
import { localDate } from '../../shared/time.js';
import type { Executor } from '../db/client.js';
import { findUserById } from '../people/people.repository.js';
import { findSite } from '../sites/sites.repository.js';
import { insertSignature } from '../signatures/signatures.repository.js';
import { replaceContent } from '../procedures/content.repository.js';
import { insertProcedure, insertVersion, touchProcedure, updateVersion, type VersionRow } from '../procedures/procedures.repository.js';
import { insertAcknowledgement, insertRequests } from '../procedures/acknowledgements.repository.js';
import type { SeedProcedure, SeedVersion } from './procedures/types.js';
import { isolation } from './procedures/isolation.js';
import { liveCommissioning } from './procedures/live-commissioning.js';
import { motorFaultFinding } from './procedures/motor-fault-finding.js';
import { heaterDraft } from './procedures/heater-draft.js';

const PROCEDURES: SeedProcedure[] = [isolation, liveCommissioning, motorFaultFinding, heaterDraft];
const DAY = 86_400_000;

/** The demo procedures: drafts are written, then moved through review and publication as the lifecycle allows. */
export const seedProcedures: SeedStep = async (tx, clock, audit, ctx) => {
  const now = clock.now();
  for (const p of PROCEDURES) {
    const authorId = ctx.people[p.author];
    const approverId = ctx.people[p.approver];
    const approver = (await findUserById(tx, approverId))!;
    const tz = (await findSite(tx, ctx.sites[p.site]))!.timeZone;
    const keys = new Map<string, string>();
    const keyOf = (id: string) => keys.get(id) ?? keys.set(id, randomUUID()).get(id)!;
    const created = new Date(now.getTime() - (Math.max(0, ...p.versions.map((v) => v.publishedDaysAgo ?? 0)) + 3) * DAY);
    const proc = await insertProcedure(tx, { code: p.code, siteId: ctx.sites[p.site], ownerId: authorId, createdAt: created, updatedAt: now, updatedBy: authorId });
    await audit(tx, { actorId: null, action: 'seed.procedure', entity: 'procedure', entityId: proc.id, newValues: { code: p.code } });
    const published: VersionRow[] = [];
    for (const [i, v] of p.versions.entries()) {
      const at = v.publishedDaysAgo === undefined ? now : new Date(now.getTime() - v.publishedDaysAgo * DAY);
      const row = await insertVersion(tx, {
        procedureId: proc.id, number: i + 1, status: 'draft', basedOnId: published.at(-1)?.id ?? null, title: v.title, category: p.category,
        reviewPeriodMonths: p.reviewPeriodMonths, scope: v.scope, hazards: v.hazards, ppe: v.ppe, equipment: v.equipment,
        changeClass: v.change?.changeClass ?? null, changeSummary: v.change?.summary ?? null, rereadDays: v.rereadDays ?? 14,
        authorId, createdAt: new Date(at.getTime() - 3 * DAY), updatedAt: at,
      });
      await replaceContent(tx, row.id, contentOf(v, keyOf));
      await updateVersion(tx, row.id, { status: 'in_review', submittedAt: new Date(at.getTime() - DAY) });
      if (v.publishedDaysAgo === undefined) continue;
      const previous = published.at(-1);
      if (previous) await updateVersion(tx, previous.id, { status: 'superseded', supersededAt: at });
      const sig = await insertSignature(tx, { signerId: approverId, printedName: approver.name, meaning: APPROVAL_MEANING, entity: 'procedure_version', entityId: row.id, signedAt: at });
      const asks = i > 0 && v.change?.changeClass !== 'editorial';
      published.push(await updateVersion(tx, row.id, {
        status: 'published', approvedBy: approverId, approvalSignatureId: sig.id, publishedAt: at,
        reviewDueOn: addMonths(localDate(at, tz), p.reviewPeriodMonths),
        ackFromNumber: asks ? i + 1 : (previous?.ackFromNumber ?? i + 1), assessFromNumber: v.change?.changeClass === 're-assess' ? i + 1 : (previous?.assessFromNumber ?? 1),
      }));
    }
    // The last change is the newest version's, not the moment the demo was seeded.
    const last = p.versions.some((v) => v.publishedDaysAgo === undefined) ? now : published.at(-1)!.publishedAt!;
    await touchProcedure(tx, proc.id, last, authorId);
    await seedAcknowledgements(tx, p, published, ctx.people, tz);
  }
};

function contentOf(v: SeedVersion, keyOf: (id: string) => string) {
  // The demo keeps to the rule the editor enforces.
  const misplaced = computedRuleOutsidePractical(v.checklists);
  if (misplaced) throw new Error(`${v.title} ${misplaced}: ${COMPUTED_NEEDS_PRACTICAL}`);
  const stepOf = (id?: string) => (id && v.steps.some((s) => s.id === id) ? keyOf(id) : null);
  return {
    steps: v.steps.map((s) => ({ key: keyOf(s.id), text: s.text, caution: s.caution ?? null, holdPoint: s.holdPoint ?? false })),
    checklists: v.checklists.map((c, ci) => {
      const parsed = checklistSchema.parse(c);
      return {
        key: keyOf(`${v.title}-list-${ci}`), kind: parsed.kind, title: parsed.title,
        items: parsed.items.map((it, ii) => ({
          key: keyOf(`${v.title}-list-${ci}-item-${ii}`), kind: it.kind, prompt: it.prompt, guidance: it.guidance,
          unit: it.kind === 'measurement' ? it.unit : null, rule: it.kind === 'measurement' ? it.rule : null,
          stepKey: stepOf(c.items[ii].step),
        })),
      };
    }),
  };
}

/** Acknowledgements a day after each publication; a re-read version asks again those who only read the one before. */
async function seedAcknowledgements(tx: Executor, p: SeedProcedure, published: VersionRow[], people: Record<string, string>, tz: string) {
  for (const a of p.acknowledgements) {
    const v = published[a.version - 1];
    const user = (await findUserById(tx, people[a.email]))!;
    const at = new Date(v.publishedAt!.getTime() + 86_400_000);
    const sig = await insertSignature(tx, { signerId: user.id, printedName: user.name, meaning: ACKNOWLEDGEMENT_MEANING, entity: 'procedure_version', entityId: v.id, signedAt: at });
    await insertAcknowledgement(tx, { procedureId: v.procedureId, versionId: v.id, versionNumber: v.number, userId: user.id, signatureId: sig.id, acknowledgedAt: at });
  }
  for (const v of published.slice(1)) {
    if (v.ackFromNumber !== v.number) continue;
    const readers = [...new Set(p.acknowledgements.filter((a) => a.version < v.number).map((a) => a.email))];
    await insertRequests(tx, readers.map((email) => ({
      procedureId: v.procedureId, versionId: v.id, userId: people[email], changeClass: v.changeClass!, createdAt: v.publishedAt!,
      dueOn: addDays(localDate(v.publishedAt!, tz), v.rereadDays),
    })));
  }
}
