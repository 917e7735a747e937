import { afterEach, describe, expect, it, vi } from 'vitest';
import AuthorisationImportPanel from '@/components/AuthorisationImportPanel.vue';
import type { ImportJobView, ImportReport } from '@shared/authorisations/views';
import { fakeFetch, getByRole, mountWith, settle, type, userWith } from './support';

afterEach(() => {
  vi.unstubAllGlobals();
  document.body.innerHTML = '';
});

const job = (over: Partial<ImportJobView>): ImportJobView => ({
  id: '40000000-0000-4000-8000-000000000001', status: 'queued', total: 260, done: 0, written: null, error: null, createdAt: '2026-03-02T09:00:00.000Z', finishedAt: null, ...over,
});
const rows = [{ line: 2, email: 'paper.0@example.test', scope: 'DW-1', problems: [] }];

describe('importing a large CSV file', () => {
  it('when the server answers with a job, then the panel shows its progress while polling and the counts once it is done', async () => {
    const states = [job({ status: 'running', done: 100 }), job({ status: 'done', done: 260, written: { people: 260, authorisations: 260 } })];
    const calls = fakeFetch((c) => {
      if (c.url.pathname === '/api/authorisations/import') {
        const dryRun = (c.body as { dryRun: boolean }).dryRun;
        const report: ImportReport = { dryRun, ok: true, rows, written: null, ...(dryRun ? {} : { job: job({}) }) };
        return { body: report };
      }
      if (c.url.pathname === `/api/authorisations/import/jobs/${job({}).id}`) return { body: states.length > 1 ? states.shift() : states[0] };
      return undefined;
    });
    await mountWith(AuthorisationImportPanel, { user: userWith(['manager']) });
    await type(getByRole('textbox', 'CSV'), 'email,name\npaper.0@example.test,Paper');
    getByRole('button', 'Check (dry run)').click();
    await settle();
    await type(document.querySelector('input[type="password"]') as HTMLElement, 'amber-lamp-on-bench-4');
    getByRole('button', 'Import every row').click();
    await settle();
    expect(document.body.textContent).toContain('Waiting to start: 0 of 260 rows');
    await vi.waitFor(() => expect(document.body.textContent).toContain('Writing: 100 of 260 rows'), { timeout: 5000 });
    await vi.waitFor(() => expect(document.body.textContent).toContain('Written: 260 new people and 260 authorisations.'), { timeout: 5000 });
    expect(calls.filter((c) => c.url.pathname.includes('/jobs/')).length).toBe(2);
  });
});
