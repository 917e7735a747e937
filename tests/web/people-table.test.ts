import { afterEach, describe, expect, it, vi } from 'vitest';
import PeopleTable from '@/components/PeopleTable.vue';
import { fakeFetch, getByRole, LEIPZIG, mountWith, settle, sitesReply, type, userWith, type Call } from './support';

afterEach(() => {
  vi.unstubAllGlobals();
  document.body.innerHTML = '';
});

const row = {
  id: '20000000-0000-4000-8000-000000000001', email: 'tomasz@example.test', name: 'Tomasz Wójcik', siteId: LEIPZIG.id, siteName: LEIPZIG.name,
  roles: ['technician'], coveredSiteIds: [], active: true, accessEndsOn: null, hasPassword: false, createdAt: '2026-03-29T00:30:00.000Z',
};

function serve() {
  return fakeFetch((c) => sitesReply(c) ?? (c.url.pathname === '/api/people' ? { body: { items: [row], total: 1, page: 1, pageSize: 25 } } : undefined));
}
const peopleCalls = (calls: Call[]) => calls.filter((c) => c.url.pathname === '/api/people').map((c) => Object.fromEntries(c.url.searchParams));

describe('the people table', () => {
  it('when it opens, then it asks the server for the first page sorted by name', async () => {
    const calls = serve();
    await mountWith(PeopleTable, { user: userWith(['manager']), path: '/people' });
    expect(peopleCalls(calls)[0]).toEqual({ page: '1', pageSize: '25', sort: 'name', dir: 'asc' });
    expect(document.body.textContent).toContain('Tomasz Wójcik');
    // Shown in the viewer's site zone: 29 March 2026 00:30 UTC is 01:30 CET, just before the change to summer time.
    expect(document.body.textContent).toContain('29 Mar 2026, 01:30 CET');
  });

  it('when the user types a search, then it asks again from page 1 with the search text', async () => {
    const calls = serve();
    await mountWith(PeopleTable, { user: userWith(['manager']), path: '/people' });
    await type(getByRole('textbox', 'Search by name or e-mail'), 'wój');
    await vi.waitFor(() => expect(peopleCalls(calls).at(-1)).toEqual({ page: '1', pageSize: '25', sort: 'name', dir: 'asc', q: 'wój' }));
  });

  it('when the user sorts by e-mail, then it asks the server for that order', async () => {
    const calls = serve();
    await mountWith(PeopleTable, { user: userWith(['manager']), path: '/people' });
    const header = [...document.querySelectorAll('th')].find((th) => th.textContent?.includes('E-mail'))!;
    header.click();
    await settle();
    expect(peopleCalls(calls).at(-1)).toMatchObject({ sort: 'email', dir: 'asc' });
  });

  it('when a person has no password yet, then a button sends the invitation again', async () => {
    const calls = serve();
    await mountWith(PeopleTable, { user: userWith(['manager']), path: '/people' });
    getByRole('button', 'Send the invitation again to Tomasz Wójcik').click();
    await settle();
    expect(calls.at(-1)).toMatchObject({ method: 'POST' });
    expect(calls.at(-1)!.url.pathname).toBe(`/api/people/${row.id}/invitation`);
  });

  it('when nobody matches, then it says so', async () => {
    fakeFetch((c) => sitesReply(c) ?? (c.url.pathname === '/api/people' ? { body: { items: [], total: 0, page: 1, pageSize: 25 } } : undefined));
    await mountWith(PeopleTable, { user: userWith(['manager']), path: '/people' });
    expect(document.body.textContent).toContain('Nobody matches');
  });
});
