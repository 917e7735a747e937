import type { Deps } from '../deps.js';
import type { AppAbility } from '../../shared/abilities.js';
import type { MatrixQuery } from '../../shared/schemas/register.js';
import { STATE_LABELS } from '../../shared/authorisations/kinds.js';
import type { MatrixPage } from '../../shared/register/views.js';
import { accessibleWhere } from '../authz/casl-sql.js';
import { lastDay } from '../authorisations/dates.js';
import { registerAccessColumns } from './register.repository.js';
import { matrixPage, matrixScopes } from './matrix.repository.js';
import { resolveMoment } from './moment.js';

/** People down the side, scopes across the top, each cell the state and expiry at the moment. */
export function makeMatrixService({ db, clock }: Deps) {
  async function page(ability: AppAbility, q: MatrixQuery): Promise<MatrixPage> {
    const m = resolveMoment(q, clock.now());
    const liveWork = q.liveWork === undefined ? undefined : q.liveWork === 'true';
    const access = accessibleWhere(ability, 'read', 'Register', registerAccessColumns);
    const [rows, scopes] = await Promise.all([matrixPage(db, { access, moment: m, siteId: q.siteId, q: q.q, liveWork }, q.page, q.pageSize), matrixScopes(db, liveWork)]);
    const people: MatrixPage['people'] = [];
    for (const r of rows) {
      let person = people.at(-1);
      if (person?.id !== r.personId) {
        person = { id: r.personId, name: r.name, siteCode: r.siteCode, active: r.active, cells: {} };
        people.push(person);
      }
      if (r.scopeId && r.state && r.endsAt && r.authorisationId) {
        person.cells[r.scopeId] = { authorisationId: r.authorisationId, state: r.state, stateLabel: STATE_LABELS[r.state], validUntil: lastDay(new Date(r.endsAt), r.timeZone) };
      }
    }
    return { ...m.info, scopes, people, total: rows.length ? Number(rows[0].total) : 0, page: q.page, pageSize: q.pageSize };
  }
  return { page };
}
