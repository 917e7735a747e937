import { endOfLocalDay, formatDay } from './dates.js';
import type { Evaluator } from './requirements.js';

/**
 * The version in force acknowledged. When a re-read or re-assess version asks the person again, the
 * earlier acknowledgement still counts until the deadline, and a period resting on it ends there.
 */
export const evaluateProcedureAck: Evaluator = (req, facts) => {
  const fact = facts.acks.get(req.procedureId!);
  const name = fact ? `${fact.code}${fact.inForce ? ` “${fact.inForce.title}”` : ''}` : 'the procedure';
  const base = { requirementId: req.id, kind: 'procedure_ack' as const, label: `Acknowledged ${name} (version in force)` };
  const none = { evidence: [], metSince: null, restsUntil: null };
  if (!fact?.inForce) return { ...base, met: false, detail: `${name} has no version in force.`, ...none };
  const v = fact.inForce;
  const ack = fact.latest;
  if (ack && ack.number >= v.ackFromNumber) {
    return {
      ...base, met: true, detail: `Version ${ack.number} acknowledged.`,
      evidence: [{ type: 'acknowledgement', id: ack.id, label: `${fact.code} version ${ack.number} acknowledged`, at: ack.at }],
      metSince: ack.at, restsUntil: null,
    };
  }
  if (ack && fact.request) {
    const deadline = endOfLocalDay(fact.request.dueOn, facts.person.timeZone);
    const due = formatDay(fact.request.dueOn);
    if (facts.now < deadline) {
      return {
        ...base, met: true, detail: `Version ${ack.number} acknowledged; version ${v.number} must be acknowledged by ${due}.`,
        evidence: [{ type: 'acknowledgement', id: ack.id, label: `${fact.code} version ${ack.number} acknowledged (re-read of version ${v.number} due ${due})`, at: ack.at }],
        metSince: ack.at, restsUntil: deadline,
      };
    }
    return { ...base, met: false, detail: `Version ${v.number} was to be acknowledged by ${due}.`, evidence: [], metSince: null, restsUntil: deadline };
  }
  return { ...base, met: false, detail: `Read and acknowledge version ${v.number}.`, ...none };
};
