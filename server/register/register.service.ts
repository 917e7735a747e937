import type { Deps } from '../deps.js';
import type { Actor, AppAbility } from '../../shared/abilities.js';
import type { RegisterFilter, RegisterQuery } from '../../shared/schemas/register.js';
import { REGISTER_VIEW_LABELS, REGISTER_PDF_MAX_ROWS } from '../../shared/register/kinds.js';
import { STATE_LABELS } from '../../shared/authorisations/kinds.js';
import type { RegisterPage } from '../../shared/register/views.js';
import { formatInZone } from '../../shared/time.js';
import { accessibleWhere } from '../authz/casl-sql.js';
import { AppError } from '../errors.js';
import { findSite } from '../sites/sites.repository.js';
import { findUserById } from '../people/people.repository.js';
import { scopesWithRequirements } from '../authorisations/scopes.repository.js';
import { registerAccessColumns, registerPage, registerRows, type RegisterWhere } from './register.repository.js';
import { resolveMoment } from './moment.js';
import { presentRow } from './register.present.js';

/** Who asked, when, and the register they asked for: what every export states and the audit trail records. */
export interface ExportContext {
  where: RegisterWhere;
  filter: RegisterFilter;
  info: ReturnType<typeof resolveMoment>['info'];
  producedAt: Date;
  producedBy: string;
  zone: string;
  lines: string[];
}

export function makeRegisterService(deps: Deps) {
  const { db, clock } = deps;

  function whereFor(ability: AppAbility, f: RegisterFilter) {
    const m = resolveMoment(f, clock.now());
    const where: RegisterWhere = {
      access: accessibleWhere(ability, 'read', 'Register', registerAccessColumns), moment: m,
      siteId: f.siteId, scopeId: f.scopeId, personId: f.personId, q: f.q, state: f.state, liveWork: f.liveWork === undefined ? undefined : f.liveWork === 'true',
    };
    return { where, info: m.info };
  }

  async function page(ability: AppAbility, q: RegisterQuery): Promise<RegisterPage> {
    const { where, info } = whereFor(ability, q);
    const { items, total } = await registerPage(db, where, q.sort, q.dir, q.page, q.pageSize);
    return { ...info, items: items.map(presentRow), total, page: q.page, pageSize: q.pageSize };
  }

  /** The filter in words, for the head of an export. */
  async function describe(f: RegisterFilter, zone: string, at: Date): Promise<string[]> {
    const parts: string[] = [];
    if (f.siteId) parts.push(`site ${(await findSite(db, f.siteId))?.code ?? f.siteId}`);
    if (f.scopeId) parts.push(`scope ${(await scopesWithRequirements(db, [f.scopeId]))[0]?.code ?? f.scopeId}`);
    if (f.personId) parts.push(`person ${(await findUserById(db, f.personId))?.name ?? f.personId}`);
    if (f.q) parts.push(`name contains “${f.q}”`);
    if (f.state) parts.push(`state ${STATE_LABELS[f.state]}`);
    if (f.liveWork) parts.push(f.liveWork === 'true' ? 'scopes that allow live work' : 'scopes without live work');
    return [
      `Register as it stood at ${formatInZone(at, zone)} (${at.toISOString()})`,
      `Read: ${REGISTER_VIEW_LABELS[f.at ? f.view : 'effective']}`,
      `Filter: ${parts.length ? parts.join(', ') : 'none (everything you may see)'}`,
    ];
  }

  async function exportContext(actor: Actor, ability: AppAbility, f: RegisterFilter): Promise<ExportContext> {
    const { where, info } = whereFor(ability, f);
    const [me, site] = await Promise.all([findUserById(db, actor.id), findSite(db, actor.siteId)]);
    const zone = site?.timeZone ?? 'UTC';
    return { where, filter: f, info, producedAt: clock.now(), producedBy: me?.name ?? actor.id, zone, lines: await describe(f, zone, new Date(info.at)) };
  }

  /** Every row for the PDF: a register too big for one report goes to CSV instead. */
  async function allRows(ctx: ExportContext) {
    const rows = await registerRows(db, ctx.where, ctx.filter.sort, ctx.filter.dir, REGISTER_PDF_MAX_ROWS + 1);
    if (rows.length > REGISTER_PDF_MAX_ROWS) {
      throw new AppError(413, 'too_many_rows', `The register as filtered has more than ${REGISTER_PDF_MAX_ROWS} rows: narrow the filter for a PDF, or export CSV.`);
    }
    return rows.map(presentRow);
  }

  return { page, exportContext, allRows };
}
export type RegisterService = ReturnType<typeof makeRegisterService>;
