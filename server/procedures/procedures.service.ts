import { randomUUID } from 'node:crypto';
import type { Deps } from '../deps.js';
import type { Actor, AppAbility } from '../../shared/abilities.js';
import { localDate } from '../../shared/time.js';
import { COMPUTED_NEEDS_PRACTICAL, computedRuleOutsidePractical } from '../../shared/schemas/checklists.js';
import type { CreateProcedureBody, ProcedureListQuery, SaveDraftBody } from '../../shared/schemas/procedures.js';
import { accessibleWhere } from '../authz/casl-sql.js';
import { procedureVersions } from '../db/schema/index.js';
import { badRequest, conflict, unprocessable } from '../errors.js';
import { findSite } from '../sites/sites.repository.js';
import { existingProcedure, existingVersion, readableVersion } from './procedures.access.js';
import { loadContent, replaceContent, type VersionContent } from './content.repository.js';
import { listProcedures } from './list.repository.js';
import * as repo from './procedures.repository.js';
import { presentRow } from './procedures.present.js';
import { procedureView, versionView } from './procedures.views.js';

export function makeProceduresService(deps: Deps) {
  const { db, clock, audit } = deps;

  async function list(actor: Actor, ability: AppAbility, q: ProcedureListQuery) {
    const access = accessibleWhere(ability, 'read', 'Procedure', { status: procedureVersions.status, authorId: procedureVersions.authorId });
    const now = clock.now();
    const { items, total } = await listProcedures(db, { ...q, access, viewerId: actor.id, now });
    const today = localDate(now, (await findSite(db, actor.siteId))?.timeZone ?? 'UTC');
    return { items: items.map((r) => presentRow(r, today)), total, page: q.page, pageSize: q.pageSize };
  }

  async function create(actor: Actor, body: CreateProcedureBody) {
    if (await repo.findProcedureByCode(db, body.code)) throw conflict('code: a procedure with this code exists', { code: 'already in use' });
    const now = clock.now();
    const version = await db.transaction(async (tx) => {
      const p = await repo.insertProcedure(tx, { code: body.code, siteId: actor.siteId, ownerId: actor.id, createdAt: now, updatedAt: now, updatedBy: actor.id });
      const v = await repo.insertVersion(tx, {
        procedureId: p.id, number: 1, status: 'draft', title: body.title, category: body.category, reviewPeriodMonths: body.reviewPeriodMonths,
        scope: '', hazards: [], ppe: [], equipment: [], rereadDays: 14, authorId: actor.id, createdAt: now, updatedAt: now,
      });
      await audit(tx, { actorId: actor.id, action: 'procedure.created', entity: 'procedure', entityId: p.id, newValues: { ...body, versionId: v.id } });
      return v;
    });
    return versionView(db, clock, actor, version);
  }

  async function saveDraft(actor: Actor, procedureId: string, versionId: string, body: SaveDraftBody) {
    const content = withKeys(body);
    const before = await existingVersion(db, procedureId, versionId);
    refuseUnlessDraft(before);
    if (before.number === 1 && (body.changeClass || body.changeSummary)) {
      throw badRequest('changeClass: the first version has no change class', { changeClass: 'the first version has no change class' });
    }
    const now = clock.now();
    const saved = await db.transaction(async (tx) => {
      await existingProcedure(tx, procedureId, true);
      const v = await existingVersion(tx, procedureId, versionId);
      refuseUnlessDraft(v);
      const editorIds = actor.id === v.authorId || v.editorIds.includes(actor.id) ? v.editorIds : [...v.editorIds, actor.id];
      const { steps: _s, checklists: _c, ...fields } = body;
      const row = await repo.updateVersion(tx, v.id, { ...fields, editorIds, updatedAt: now });
      await replaceContent(tx, v.id, content);
      await repo.touchProcedure(tx, procedureId, now, actor.id);
      await audit(tx, {
        actorId: actor.id, action: 'procedure.draft_saved', entity: 'procedure_version', entityId: v.id,
        oldValues: pickFields(v), newValues: { ...fields, steps: content.steps, checklists: content.checklists },
      });
      return row;
    });
    return versionView(db, clock, actor, saved);
  }

  /** The next draft starts as a copy of the version in force (or of the newest one, after a withdrawal). */
  async function newDraft(actor: Actor, procedureId: string) {
    const now = clock.now();
    const draft = await db.transaction(async (tx) => {
      await existingProcedure(tx, procedureId, true);
      const open = await repo.openVersion(tx, procedureId);
      if (open) throw conflict(`Version ${open.number} is already ${open.status === 'draft' ? 'being drafted' : 'in review'}; work on that one.`);
      const base = (await repo.publishedVersion(tx, procedureId)) ?? (await repo.versionsOf(tx, procedureId))[0];
      const v = await repo.insertVersion(tx, {
        procedureId, number: base.number + 1, status: 'draft', basedOnId: base.id, title: base.title, category: base.category,
        reviewPeriodMonths: base.reviewPeriodMonths, scope: base.scope, hazards: base.hazards, ppe: base.ppe, equipment: base.equipment,
        rereadDays: base.rereadDays, authorId: actor.id, createdAt: now, updatedAt: now,
      });
      await replaceContent(tx, v.id, await loadContent(tx, base.id));
      await repo.touchProcedure(tx, procedureId, now, actor.id);
      await audit(tx, { actorId: actor.id, action: 'procedure.draft_started', entity: 'procedure_version', entityId: v.id, newValues: { number: v.number, basedOn: base.number } });
      return v;
    });
    return versionView(db, clock, actor, draft);
  }

  return {
    list,
    create,
    saveDraft,
    newDraft,
    get: (ability: AppAbility, id: string) => procedureView(db, clock, ability, id),
    getVersion: async (actor: Actor, ability: AppAbility, id: string, versionId: string) =>
      versionView(db, clock, actor, await readableVersion(db, ability, id, versionId)),
  };
}

export function refuseUnlessDraft(v: repo.VersionRow) {
  if (v.status === 'draft') return;
  const why = v.status === 'in_review' ? 'it is in review; it must be returned to draft first' : `it is ${v.status} and never changes; start a new draft instead`;
  throw conflict(`Version ${v.number} cannot be edited: ${why}.`);
}

/** Keys give steps and checklist entries their identity across versions; new ones get a fresh key. */
function withKeys(body: SaveDraftBody): VersionContent {
  const steps = body.steps.map((s) => ({ key: s.key ?? randomUUID(), text: s.text, caution: s.caution, holdPoint: s.holdPoint }));
  const checklists = body.checklists.map((c) => ({
    key: c.key ?? randomUUID(), kind: c.kind, title: c.title,
    items: c.items.map((i) => ({
      key: i.key ?? randomUUID(), kind: i.kind, prompt: i.prompt, guidance: i.guidance,
      unit: i.kind === 'measurement' ? i.unit : null, rule: i.kind === 'measurement' ? i.rule : null, stepKey: i.stepKey,
    })),
  }));
  unique(steps.map((s) => s.key), (i) => `steps.${i}.key`);
  unique(checklists.map((c) => c.key), (i) => `checklists.${i}.key`);
  checklists.forEach((c, ci) => unique(c.items.map((i) => i.key), (i) => `checklists.${ci}.items.${i}.key`));
  const ruleField = computedRuleOutsidePractical(checklists);
  if (ruleField) throw unprocessable(`${ruleField}: ${COMPUTED_NEEDS_PRACTICAL}`, { [ruleField]: COMPUTED_NEEDS_PRACTICAL });
  const stepKeys = new Set(steps.map((s) => s.key));
  checklists.forEach((c, ci) => c.items.forEach((i, ii) => {
    const field = `checklists.${ci}.items.${ii}.stepKey`;
    if (i.stepKey && !stepKeys.has(i.stepKey)) throw unprocessable(`${field}: not a step of this version; choose one of its steps`, { [field]: 'not a step of this version; choose one of its steps' });
  }));
  return { steps, checklists };
}

function unique(keys: string[], field: (i: number) => string) {
  const seen = new Set<string>();
  keys.forEach((k, i) => {
    if (seen.has(k)) throw badRequest(`${field(i)}: this key is used twice`, { [field(i)]: 'this key is used twice' });
    seen.add(k);
  });
}

function pickFields(v: repo.VersionRow) {
  const { title, category, reviewPeriodMonths, scope, hazards, ppe, equipment, changeSummary, changeClass, rereadDays } = v;
  return { title, category, reviewPeriodMonths, scope, hazards, ppe, equipment, changeSummary, changeClass, rereadDays };
}
