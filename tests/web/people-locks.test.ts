import { afterEach, describe, expect, it, vi } from 'vitest';
import PeopleEditDialog from '@/components/PeopleEditDialog.vue';
import PeopleTable from '@/components/PeopleTable.vue';
import { fakeFetch, getByRole, LEIPZIG, messagesBeside, mountWith, queryAllByRole, settle, sitesReply, userWith } from './support';

afterEach(() => {
  vi.unstubAllGlobals();
  document.body.innerHTML = '';
});

const base = {
  email: 'p@example.test', siteId: LEIPZIG.id, coveredSiteIds: [], active: true, accessEndsOn: null, deactivatedReason: null, hasPassword: true,
  createdAt: '2026-01-05T09:00:00.000Z',
};
const tech = { ...base, id: '20000000-0000-4000-8000-000000000002', name: 'Marcus Boateng', roles: ['technician'] };
const me = { ...base, id: userWith(['manager']).id, name: 'Pat Example', roles: ['manager'] };
const disabled = (el: HTMLElement) => !!el.closest('.v-input')?.classList.contains('v-input--disabled');

function serve(person: typeof tech) {
  return fakeFetch((c) => {
    if (c.url.pathname === `/api/people/${person.id}/sessions`) return { body: { ended: 3 } };
    return sitesReply(c) ?? (c.url.pathname === `/api/people/${person.id}` ? { body: person } : undefined);
  });
}

describe('what the edit dialog lets a person change', () => {
  it('when a manager opens their own record, then only the name is open and the rest says why not', async () => {
    serve(me);
    await mountWith(PeopleEditDialog, { user: userWith(['manager']), path: '/people', props: { personId: me.id } });
    expect(disabled(getByRole('textbox', 'Full name'))).toBe(false);
    const access = document.querySelector<HTMLElement>('input[type="date"]')!;
    expect(disabled(access)).toBe(true);
    expect(messagesBeside(access)).toBe('You cannot change the end of your own access.');
    expect(document.body.textContent).toContain('You cannot change your own roles.');
    expect(document.body.textContent).toContain('You cannot switch your own account off.');
    expect(queryAllByRole('button', 'End all sessions')).toHaveLength(0);
  });

  it('when an admin ends all sessions of a person, then it asks first and then sends the request', async () => {
    const calls = serve(tech);
    await mountWith(PeopleEditDialog, { user: userWith(['admin']), path: '/people', props: { personId: tech.id } });
    getByRole('button', 'End all sessions').click();
    await settle();
    expect(calls.some((c) => c.method === 'DELETE'), 'nothing sent before the confirmation').toBe(false);
    expect(document.body.textContent).toContain('End all sessions of Marcus Boateng?');
    getByRole('button', 'Yes, end them').click();
    await settle();
    expect(calls.at(-1)).toMatchObject({ method: 'DELETE' });
    expect(calls.at(-1)!.url.pathname).toBe(`/api/people/${tech.id}/sessions`);
  });
});

describe('the people table', () => {
  it('when a manager sees a technician and another manager of their site, then only the technician has an edit button', async () => {
    const row = (p: typeof tech) => ({ ...p, siteName: LEIPZIG.name });
    const other = { ...tech, id: '20000000-0000-4000-8000-000000000003', name: 'Other Manager', roles: ['manager'] };
    fakeFetch((c) => sitesReply(c) ?? (c.url.pathname === '/api/people' ? { body: { items: [row(tech), row(other)], total: 2, page: 1, pageSize: 25 } } : undefined));
    await mountWith(PeopleTable, { user: userWith(['manager']), path: '/people' });
    expect(queryAllByRole('button', 'Edit Marcus Boateng')).toHaveLength(1);
    expect(queryAllByRole('button', 'Edit Other Manager')).toHaveLength(0);
  });
});
