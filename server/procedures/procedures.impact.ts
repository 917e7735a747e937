import type { ImpactView } from '../../shared/procedures/reports.js';
import type { ChangeClass } from '../../shared/schemas/procedures.js';
import { addDays } from '../../shared/procedures/dates.js';
import { localDate } from '../../shared/time.js';
import type { Executor } from '../db/client.js';
import { earlierAcknowledgers } from './acknowledgements.repository.js';
import { authorisationsRestingOn } from './authorisations-impact.repository.js';
import type { VersionRow } from './procedures.repository.js';

/** What publishing this version asks of people: the first issue and editorial changes ask nothing. */
export function asksOf(v: Pick<VersionRow, 'number' | 'changeClass'>): ImpactView['asks'] {
  if (v.number === 1 || !v.changeClass || v.changeClass === 'editorial') return 'nothing';
  return v.changeClass as 're-read' | 're-assess';
}

/**
 * Exactly the people publishing would ask to re-read (and be re-assessed): every active person who
 * acknowledged an earlier version. The approver's preview and the publication both use this.
 */
export async function affectedPeople(db: Executor, v: VersionRow, now: Date) {
  if (asksOf(v) === 'nothing') return [];
  const rows = await earlierAcknowledgers(db, v.procedureId, v.number);
  return rows.map((r) => ({ ...r, dueOn: addDays(localDate(now, r.timeZone), v.rereadDays) }));
}

export async function impactOf(db: Executor, v: VersionRow, now: Date): Promise<ImpactView> {
  const people = await affectedPeople(db, v, now);
  return {
    changeClass: v.changeClass as ChangeClass | null,
    asks: asksOf(v),
    people: people.map((p) => ({ userId: p.userId, name: p.name, email: p.email, siteName: p.siteName, lastAcknowledgedNumber: p.lastNumber, dueOn: p.dueOn })),
    authorisations: (await authorisationsRestingOn(db, v.procedureId, now)).map((a) => ({
      ...a, runsUntil: new Date(a.runsUntil).toISOString(), practicalsNoLongerCount: v.changeClass === 're-assess' && v.number > 1 && a.requires.includes('practicals'),
    })),
  };
}
