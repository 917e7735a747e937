import type { Deps } from '../deps.js';
import type { Actor, AppAbility } from '../../shared/abilities.js';
import type { CompareView } from '../../shared/procedures/reports.js';
import type { VersionStatus } from '../../shared/schemas/procedures.js';
import { badRequest } from '../errors.js';
import { loadContent } from './content.repository.js';
import { readableVersion } from './procedures.access.js';
import { compareVersions } from './procedures.diff.js';
import { renderVersionPdf } from './procedures.pdf.js';
import { versionView } from './procedures.views.js';

/** Reading a procedure in other forms: two versions side by side, and print. */
export function makeProcedureDocuments({ db, clock }: Deps) {
  async function compare(ability: AppAbility, id: string, fromId: string, toId: string): Promise<CompareView> {
    if (fromId === toId) throw badRequest('to: choose two different versions', { to: 'choose a different version' });
    const [a, b] = await Promise.all([readableVersion(db, ability, id, fromId), readableVersion(db, ability, id, toId)]);
    const [from, to] = a.number < b.number ? [a, b] : [b, a];
    const [fc, tc] = await Promise.all([loadContent(db, from.id), loadContent(db, to.id)]);
    return {
      from: { id: from.id, number: from.number, status: from.status as VersionStatus },
      to: { id: to.id, number: to.number, status: to.status as VersionStatus },
      sections: compareVersions({ v: from, c: fc }, { v: to, c: tc }),
    };
  }

  async function pdf(actor: Actor, ability: AppAbility, id: string, versionId: string) {
    const view = await versionView(db, clock, actor, await readableVersion(db, ability, id, versionId));
    const bytes = await renderVersionPdf(view, clock.now());
    return { bytes, fileName: `${view.code}-v${view.number}-${view.status}.pdf` };
  }

  return { compare, pdf };
}
