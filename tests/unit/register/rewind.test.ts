import { describe, it, expect } from 'vitest';
import { rewind } from '../../../server/incident/rewind.js';

describe('rewinding a record through its later changes', () => {
  it('when changes came after the moment, then their old values are put back, newest first, so the oldest wins', () => {
    const today = { code: 'LEJ-B1', rcdRatedResidualMa: 300, nextInspectionOn: '2027-01-31' };
    const later = [
      { action: 'bench.updated', oldValues: { rcdRatedResidualMa: 100 } },
      { action: 'bench.updated', oldValues: { rcdRatedResidualMa: 30, nextInspectionOn: '2026-07-29' } },
    ];
    expect(rewind(today, later)).toEqual({ code: 'LEJ-B1', rcdRatedResidualMa: 30, nextInspectionOn: '2026-07-29' });
    expect(today.rcdRatedResidualMa, 'today’s row is left as it is').toBe(300);
  });

  it('when nothing changed since, then it is today’s row; when it was created after the moment, then there was none', () => {
    expect(rewind({ serial: 'TF3-11902' }, [])).toEqual({ serial: 'TF3-11902' });
    expect(rewind({ serial: 'TF3-11902' }, [{ action: 'instrument.updated', oldValues: { notes: null } }, { action: 'instrument.created', oldValues: null }])).toBeNull();
    expect(rewind({ code: 'LEJ-B2' }, [{ action: 'seed.bench', oldValues: null }])).toBeNull();
  });
});
