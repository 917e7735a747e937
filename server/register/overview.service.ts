import type { Deps } from '../deps.js';
import type { AppAbility } from '../../shared/abilities.js';
import type { OverviewQuery } from '../../shared/schemas/register.js';
import { CHART_WEEKS, EXPIRY_WINDOWS } from '../../shared/register/kinds.js';
import type { OverviewView } from '../../shared/register/views.js';
import { accessibleWhere } from '../authz/casl-sql.js';
import { addDays } from '../authorisations/dates.js';
import { registerAccessColumns, registerRows, type RegisterWhere } from './register.repository.js';
import { expiries, overdueAcknowledgements, stateCounts } from './overview.repository.js';
import { presentRow } from './register.present.js';

/** Where things stand now, per site and scope, and what runs out over the next quarter. */
export function makeOverviewService({ db, clock }: Deps) {
  async function overview(ability: AppAbility, q: OverviewQuery): Promise<OverviewView> {
    const now = clock.now();
    const access = accessibleWhere(ability, 'read', 'Overview', registerAccessColumns);
    const where: RegisterWhere = { access, moment: { at: now, known: false }, siteId: q.siteId };
    const [counts, exp, soonest, overdue] = await Promise.all([
      stateCounts(db, where),
      expiries(db, where, EXPIRY_WINDOWS, CHART_WEEKS),
      registerRows(db, { ...where, state: 'active' }, 'expiry', 'asc', 10),
      overdueAcknowledgements(db, access, now, q.siteId, 20),
    ]);
    const perWeek = new Map(exp.weeks.map((w) => [w.week, w.n]));
    return {
      at: now.toISOString(), counts, expiring: exp.windows, soonest: soonest.map(presentRow), overdueAcknowledgements: overdue,
      weeks: Array.from({ length: CHART_WEEKS }, (_, i) => ({ from: addDays(now, i * 7).toISOString(), n: perWeek.get(i) ?? 0 })),
    };
  }
  return { overview };
}
