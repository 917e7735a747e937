import { addMonths, endOfLocalDay, formatDay, localDate, startOfLocalDay } from './dates.js';
import type { Evaluator, EvaluationFacts } from './requirements.js';
import type { RecordFact } from './records-facts.repository.js';

const nameOf = (facts: EvaluationFacts, procedureId: string) => facts.acks.get(procedureId)?.code ?? 'the procedure';

/**
 * Competent practicals of the procedure within the last M months. After a re-assess version, those done
 * against earlier versions count only until the person's re-assessment deadline.
 */
export const evaluatePracticals: Evaluator = (req, facts) => {
  const n = req.practicalsCount!;
  const months = req.practicalsWindowMonths!;
  const code = nameOf(facts, req.procedureId!);
  const base = { requirementId: req.id, kind: 'practicals' as const, label: `${n} competent supervised practical${n === 1 ? '' : 's'} on ${code} within ${months} months` };
  const tz = facts.person.timeZone;
  const since = startOfLocalDay(addMonths(localDate(facts.now, tz), -months), tz);
  const inForce = facts.thresholds.get(req.procedureId!);
  if (!inForce) return { ...base, met: false, detail: `${code} has no version in force.`, evidence: [], metSince: null, restsUntil: null };
  const recent = facts.practicals.filter((p) => p.procedureId === req.procedureId && p.heldAt >= since && p.heldAt <= facts.now).sort((a, b) => b.heldAt.getTime() - a.heldAt.getTime());
  const current = recent.filter((p) => p.versionNumber >= inForce.assessFrom);
  const request = facts.acks.get(req.procedureId!)?.request;
  const deadline = request?.changeClass === 're-assess' ? endOfLocalDay(request.dueOn, tz) : null;
  const usable = current.length >= n ? current : deadline && facts.now < deadline ? recent : current;
  const item = (p: RecordFact) => ({ type: 'practical' as const, id: p.id, label: `Competent on ${formatDay(localDate(p.heldAt, tz))} against ${code} version ${p.versionNumber}, assessed by ${p.byName}`, at: p.completedAt });
  if (usable.length >= n) {
    const counted = usable.slice(0, n);
    const leansOnOld = counted.some((p) => p.versionNumber < inForce.assessFrom);
    return {
      ...base, met: true,
      detail: leansOnOld ? `Counted until the re-assessment deadline of ${formatDay(request!.dueOn)}.` : `${counted.length} competent practical${counted.length === 1 ? '' : 's'} since ${formatDay(localDate(since, tz))}.`,
      evidence: counted.map(item), metSince: new Date(Math.max(...counted.map((p) => p.completedAt.getTime()))), restsUntil: leansOnOld ? deadline : null,
    };
  }
  const missing = n - current.length;
  const detail = deadline && facts.now >= deadline
    ? `Re-assessment against version ${inForce.number} was due by ${formatDay(request!.dueOn)}: ${missing} more competent practical${missing === 1 ? '' : 's'} needed.`
    : `${missing} more competent practical${missing === 1 ? '' : 's'} needed (${current.length} of ${n} since ${formatDay(localDate(since, tz))}).`;
  return { ...base, met: false, detail, evidence: current.map(item), metSince: null, restsUntil: deadline };
};
