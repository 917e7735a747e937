import { STATE_LABELS } from '../../shared/authorisations/kinds.js';
import { formatDay, lastDay } from './dates.js';
import type { Evaluator } from './requirements.js';

/** Another scope held and in force; this one can last no longer than that period does. */
export const evaluatePrerequisite: Evaluator = (req, facts) => {
  const scope = facts.scopes.get(req.prerequisiteScopeId!);
  const title = scope ? `“${scope.title}”` : 'the scope it rests on';
  const label = `Holds ${title}`;
  const state = facts.states.get(req.prerequisiteScopeId!);
  const base = { requirementId: req.id, kind: 'prerequisite' as const, label };
  const period = state?.period ?? null;
  if (state?.state === 'active' && period) {
    const until = formatDay(lastDay(period.endsAt, facts.person.timeZone));
    return {
      ...base, met: true, detail: `${title} is in force until ${until}.`,
      evidence: [{ type: 'authorisation', id: period.id, label: `${scope?.code ?? ''} in force until ${until}`.trim(), at: period.startsAt }],
      metSince: period.startsAt, restsUntil: period.endsAt,
    };
  }
  const how = !state || state.state === 'none' ? 'is not held yet' : `is ${STATE_LABELS[state.state].toLowerCase()}`;
  return { ...base, met: false, detail: `${title} ${how}.`, evidence: [], metSince: null, restsUntil: period?.endsAt ?? null };
};
