import { describe, it, expect } from 'vitest';
import { foldState } from '../../../server/authorisations/states.js';
import type { EventRow, PeriodRow } from '../../../server/authorisations/periods.repository.js';

const period: PeriodRow = {
  id: 'p1', authorisationId: 'a1', holderId: 'h1', scopeId: 's1', startsAt: new Date('2026-03-02T09:00:00Z'), endsAt: new Date('2027-03-02T23:00:00Z'),
  validityEndsAt: new Date('2027-03-02T23:00:00Z'), origin: 'issued', previousPeriodId: null, verificationCode: 'A'.repeat(32), evidenceSnapshot: {},
  issuedBy: null, attestedBy: null, priorEvidenceId: null, priorNote: null, recordedAt: new Date('2026-03-02T09:00:00Z'),
};
let n = 0;
const ev = (kind: string, at: string, extra: Partial<EventRow> = {}): EventRow => ({
  id: `e${++n}`, periodId: 'p1', kind, effectiveAt: new Date(at), recordedAt: new Date(at), actorId: null, reason: `${kind} reason`, cause: null, signatureId: null, details: null, ...extra,
});
const at = (iso: string, events: EventRow[]) => foldState(period, events, new Date(iso)).state;

describe('the state of a period at a moment', () => {
  const events = [
    ev('issued', '2026-03-02T09:00:00Z'),
    ev('suspended', '2026-04-01T08:00:00Z', { cause: 'manual' }),
    ev('suspended', '2026-04-02T08:00:00Z', { cause: 'certificate:first_aid_cpr' }),
    ev('reinstated', '2026-04-03T08:00:00Z', { cause: 'manual' }),
    ev('renewal_submitted', '2026-04-04T08:00:00Z', { cause: 'certificate:first_aid_cpr' }),
    ev('restored', '2026-04-05T08:00:00Z', { cause: 'certificate:first_aid_cpr' }),
  ];

  it('when suspensions on different grounds overlap, then it stays suspended until the last is lifted', () => {
    expect(at('2026-03-01T00:00:00Z', events)).toBe('none');
    expect(at('2026-03-15T00:00:00Z', events)).toBe('active');
    expect(at('2026-04-01T12:00:00Z', events)).toBe('suspended');
    expect(at('2026-04-03T12:00:00Z', events), 'the manager lifted theirs; the certificate one stands').toBe('suspended');
    expect(at('2026-04-04T12:00:00Z', events)).toBe('renewal_submitted');
    expect(at('2026-04-06T00:00:00Z', events)).toBe('active');
  });

  it('when past its end, then it is lapsed by itself, or what its closing event says', () => {
    expect(at('2027-03-03T00:00:00Z', events)).toBe('lapsed');
    const revoked = [...events, ev('revoked', '2026-05-01T00:00:00Z')];
    expect(foldState({ ...period, endsAt: new Date('2026-05-01T00:00:00Z') }, revoked, new Date('2026-06-01T00:00:00Z'))).toMatchObject({ state: 'revoked', reason: 'revoked reason' });
  });

  it('when an event was recorded later than it took effect, then a moment before it took effect does not see it', () => {
    const late = [ev('issued', '2026-03-02T09:00:00Z'), ev('suspended', '2026-07-14T22:00:00Z', { cause: 'certificate:first_aid_cpr', recordedAt: new Date('2026-07-16T10:00:00Z') })];
    expect(at('2026-07-14T21:59:59Z', late)).toBe('active');
    expect(at('2026-07-15T00:00:00Z', late)).toBe('suspended');
  });
});
