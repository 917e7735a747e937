import { afterEach, describe, expect, it, vi } from 'vitest';
import BenchesTable from '@/components/BenchesTable.vue';
import { fakeFetch, LEIPZIG, mountWith, queryAllByRole, sitesReply, userWith, type Call } from './support';

afterEach(() => {
  vi.unstubAllGlobals();
  document.body.innerHTML = '';
});

const acBench = {
  id: '30000000-0000-4000-8000-000000000001', siteId: LEIPZIG.id, siteCode: 'LEJ-W1', siteName: LEIPZIG.name, timeZone: LEIPZIG.timeZone,
  code: 'LEJ-B5', name: 'Heater bench', supplyVoltage: 230, supplyFrequency: 50, isolatingTransformer: true, isolatingTransformerVa: 1000,
  rcdType: 'AC', rcdRatedResidualMa: 30, emergencyStop: true, nextInspectionOn: '2026-01-31', notes: null, active: true, latestCheck: null,
  flags: [
    { code: 'inspection_overdue', severity: 'refuse', field: 'nextInspectionOn', message: 'bench LEJ-B5 inspection was due on 2026-01-31' },
    { code: 'rcd_type_ac', severity: 'warn', field: 'rcdType', message: 'Type AC RCD — not suitable for phase-cut loads (they leak pulsating DC; Type A or better is needed)' },
  ],
  createdAt: '2026-01-01T00:00:00.000Z', updatedAt: '2026-01-01T00:00:00.000Z',
};

function serve() {
  return fakeFetch((c) => sitesReply(c) ?? (c.url.pathname === '/api/benches' ? { body: { items: [acBench], total: 1, page: 1, pageSize: 25 } } : undefined));
}
const benchCalls = (calls: Call[]) => calls.filter((c) => c.url.pathname === '/api/benches').map((c) => Object.fromEntries(c.url.searchParams));

describe('the benches table', () => {
  it('when it opens, then it asks for the first page of benches in service, by code, and shows the state chips with their reasons', async () => {
    const calls = serve();
    await mountWith(BenchesTable, { user: userWith(['manager']), path: '/benches' });
    expect(benchCalls(calls)[0]).toEqual({ page: '1', pageSize: '25', sort: 'code', dir: 'asc', active: 'true' });
    const chips = [...document.querySelectorAll('.v-chip')];
    expect(chips.map((c) => c.textContent?.trim())).toEqual(['Inspection overdue', 'Type AC RCD — not suitable for phase-cut loads']);
    expect(chips[0].getAttribute('title')).toBe('bench LEJ-B5 inspection was due on 2026-01-31');
  });

  it('when a manager looks, then they may edit and check; a technician may only record a check', async () => {
    serve();
    await mountWith(BenchesTable, { user: userWith(['manager']), path: '/benches' });
    expect(queryAllByRole('button', 'Edit LEJ-B5')).toHaveLength(1);
    document.body.innerHTML = '';
    serve();
    await mountWith(BenchesTable, { user: userWith(['technician']), path: '/benches' });
    expect(queryAllByRole('button', 'Edit LEJ-B5')).toHaveLength(0);
    expect(queryAllByRole('button', 'Pre-use checks of LEJ-B5')).toHaveLength(1);
  });
});
