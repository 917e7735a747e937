import { endOfLocalDay, formatDay, localDate } from './dates.js';
import type { Evaluator } from './requirements.js';

/**
 * The procedure's self sign-off, countersigned by an assessor. A re-read or re-assess version asks for
 * a new one; the earlier sign-off counts until the person's deadline, and a period resting on it ends there.
 */
export const evaluateSignoff: Evaluator = (req, facts) => {
  const code = facts.acks.get(req.procedureId!)?.code ?? 'the procedure';
  const base = { requirementId: req.id, kind: 'checklist_signoff' as const, label: `Self sign-off of ${code} countersigned` };
  const inForce = facts.thresholds.get(req.procedureId!);
  if (!inForce) return { ...base, met: false, detail: `${code} has no version in force.`, evidence: [], metSince: null, restsUntil: null };
  const tz = facts.person.timeZone;
  const mine = facts.signoffs.filter((s) => s.procedureId === req.procedureId).sort((a, b) => b.completedAt.getTime() - a.completedAt.getTime());
  const current = mine.find((s) => s.versionNumber >= inForce.ackFrom);
  const item = (s: (typeof mine)[number]) => [{ type: 'signoff' as const, id: s.id, label: `${code} version ${s.versionNumber} signed off, countersigned by ${s.byName} on ${formatDay(localDate(s.completedAt, tz))}`, at: s.completedAt }];
  if (current) return { ...base, met: true, detail: `Version ${current.versionNumber} signed off and countersigned.`, evidence: item(current), metSince: current.completedAt, restsUntil: null };
  const older = mine[0];
  const request = facts.acks.get(req.procedureId!)?.request;
  if (older && request) {
    const deadline = endOfLocalDay(request.dueOn, tz);
    if (facts.now < deadline) return { ...base, met: true, detail: `Counted until ${formatDay(request.dueOn)}, when version ${inForce.number} must be signed off.`, evidence: item(older), metSince: older.completedAt, restsUntil: deadline };
    return { ...base, met: false, detail: `Version ${inForce.number} was to be signed off by ${formatDay(request.dueOn)}.`, evidence: [], metSince: null, restsUntil: deadline };
  }
  return { ...base, met: false, detail: `Complete the self sign-off of version ${inForce.number} and have it countersigned.`, evidence: [], metSince: null, restsUntil: null };
};
