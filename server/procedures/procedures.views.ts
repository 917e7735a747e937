import { subjectOf, type Actor, type AppAbility } from '../../shared/abilities.js';
import { localDate } from '../../shared/time.js';
import { APPROVAL_MEANING } from '../../shared/schemas/procedures.js';
import { minimumChangeClass } from '../../shared/procedures/change-class.js';
import type { ProcedureView, VersionView } from '../../shared/procedures/views.js';
import type { Executor } from '../db/client.js';
import type { Clock } from '../clock.js';
import { notFound } from '../errors.js';
import { signaturesFor } from '../signatures/signatures.repository.js';
import { findAcknowledgement } from './acknowledgements.repository.js';
import { loadContent, loadSteps } from './content.repository.js';
import * as repo from './procedures.repository.js';
import { peopleIn, presentSummary, presentVersion } from './procedures.present.js';

/** Builds what the API shows of one version: content, people by name, signatures, change check. */
export async function versionView(db: Executor, clock: Clock, actor: Actor, v: repo.VersionRow): Promise<VersionView> {
  const found = await repo.procedureWithSite(db, v.procedureId);
  if (!found) throw notFound('That procedure');
  const basedOn = v.basedOnId ? ((await repo.findVersion(db, v.procedureId, v.basedOnId)) ?? null) : null;
  const [content, names, baseSteps, signatures, ack] = await Promise.all([
    loadContent(db, v.id),
    repo.namesOf(db, peopleIn(v)),
    basedOn ? loadSteps(db, basedOn.id) : Promise.resolve(null),
    signaturesFor(db, 'procedure_version', [v.id]),
    findAcknowledgement(db, v.id, actor.id),
  ]);
  return presentVersion(v, {
    procedure: found.procedure, content, names, basedOn,
    changeCheck: baseSteps ? minimumChangeClass(baseSteps, content.steps) : null,
    approval: signatures.find((s) => s.id === v.approvalSignatureId && s.meaning === APPROVAL_MEANING) ?? null,
    mine: ack ? (signatures.find((s) => s.id === ack.signatureId) ?? null) : null,
    siteTimeZone: found.site.timeZone,
    today: localDate(clock.now(), found.site.timeZone),
  });
}

/** The procedure with the versions this reader may see (none: not found). */
export async function procedureView(db: Executor, clock: Clock, ability: AppAbility, id: string): Promise<ProcedureView> {
  const found = await repo.procedureWithSite(db, id);
  if (!found) throw notFound('That procedure');
  const versions = (await repo.versionsOf(db, id)).filter((v) => ability.can('read', subjectOf('Procedure', v)));
  if (!versions.length) throw notFound('That procedure');
  const names = await repo.namesOf(db, [...new Set(versions.flatMap(peopleIn))]);
  const today = localDate(clock.now(), found.site.timeZone);
  const published = versions.find((v) => v.status === 'published');
  const open = versions.find((v) => v.status === 'draft' || v.status === 'in_review');
  const { procedure, site } = found;
  return {
    id: procedure.id, code: procedure.code, site, ownerName: found.ownerName,
    createdAt: procedure.createdAt.toISOString(), updatedAt: procedure.updatedAt.toISOString(),
    inForce: published
      ? { versionId: published.id, number: published.number, reviewDueOn: published.reviewDueOn, reviewOverdue: (published.reviewDueOn ?? '9999') < today }
      : null,
    open: open ? { versionId: open.id, number: open.number, status: open.status as 'draft' | 'in_review' } : null,
    versions: versions.map((v) => presentSummary(v, names)),
  };
}
