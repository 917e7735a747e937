import type { RenewHint } from '../../shared/authorisations/views.js';
import type { ScopeEligibility } from './eligibility.js';
import { capsFor, windowStart } from './caps.js';
import { formatDay, lastDay, localDate } from './dates.js';

/** What to do to keep (or get back) one authorisation, in the holder's words. */
export function renewHints(e: ScopeEligibility, tz: string, now: Date): RenewHint[] {
  const p = e.state.period;
  const hints: RenewHint[] = e.results.filter((r) => !r.met).map((r) => ({ label: r.label, detail: r.detail }));
  const running = p && p.endsAt > now && e.state.state !== 'revoked' && e.state.state !== 'ended';
  if (!running) {
    if (p && !hints.length) hints.push({ label: 'Meet the requirements again', detail: 'It is issued again once a requirement is met with fresh evidence (a renewed certificate, a new acknowledgement).' });
    return hints;
  }
  const caps = capsFor(e.scope, p.origin, e.results);
  for (const r of e.results) {
    if (!r.met || !r.restsUntil || r.restsUntil.getTime() > p.endsAt.getTime()) continue;
    const day = formatDay(lastDay(r.restsUntil, tz));
    const grace = e.scope.certificateGraceDays;
    const then = caps.includes(r)
      ? 'which ends this authorisation too'
      : e.scope.allowsLiveWork && r.kind === 'certificate'
        ? `after which this authorisation is suspended ${grace ? `${grace} days later ` : ''}until a renewed one has been checked`
        : 'before this authorisation ends';
    hints.push({ label: r.label, detail: `${r.detail} It runs out on ${day}, ${then}: renew it before then.` });
  }
  if (p.endsAt.getTime() >= p.validityEndsAt.getTime()) {
    const opens = windowStart(p, e.scope);
    const when = opens > now ? `from ${formatDay(localDate(opens, tz))}` : 'from now';
    hints.push({ label: 'Meet the requirements again', detail: `It renews when its requirements are met again with fresh evidence (a renewed certificate, a new acknowledgement) ${when} until ${formatDay(lastDay(p.endsAt, tz))}.` });
  }
  return hints;
}
