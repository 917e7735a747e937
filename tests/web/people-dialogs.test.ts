import { afterEach, describe, expect, it, vi } from 'vitest';
import PeopleInviteDialog from '@/components/PeopleInviteDialog.vue';
import PeopleEditDialog from '@/components/PeopleEditDialog.vue';
import { fakeFetch, getByRole, LEIPZIG, messagesBeside, mountWith, settle, sitesReply, type, userWith } from './support';

afterEach(() => {
  vi.unstubAllGlobals();
  document.body.innerHTML = '';
});

const person = {
  id: '20000000-0000-4000-8000-000000000002', email: 'marcus@example.test', name: 'Marcus Boateng', siteId: LEIPZIG.id, roles: ['technician'],
  coveredSiteIds: [], active: true, accessEndsOn: null, deactivatedReason: null, hasPassword: true, createdAt: '2026-01-05T09:00:00.000Z',
};

describe('the invite dialog', () => {
  it('when the e-mail is taken, then the server says so beside the e-mail field', async () => {
    const calls = fakeFetch((c) =>
      sitesReply(c) ?? (c.method === 'POST' ? { status: 409, body: { error: { code: 'conflict', message: 'email: a person with this e-mail already exists', fields: { email: 'already in use' } } } } : undefined),
    );
    await mountWith(PeopleInviteDialog, { user: userWith(['manager']), path: '/people', props: { modelValue: true } });
    await type(getByRole('textbox', 'E-mail'), 'marcus@example.test');
    await type(getByRole('textbox', 'Full name'), 'Marcus Boateng');
    getByRole('button', 'Send the invitation').click();
    await settle();
    expect(calls.at(-1)).toMatchObject({
      method: 'POST',
      body: { email: 'marcus@example.test', name: 'Marcus Boateng', siteId: LEIPZIG.id, roles: ['technician'], coveredSiteIds: [] },
    });
    expect(messagesBeside(getByRole('textbox', 'E-mail'))).toBe('already in use');
  });
});

describe('the edit dialog', () => {
  function serve() {
    return fakeFetch((c) => sitesReply(c) ?? (c.url.pathname === `/api/people/${person.id}` ? { body: c.method === 'PATCH' ? { ...person, ...(c.body as object) } : person } : undefined));
  }

  it('when only the name changes, then only the name is sent', async () => {
    const calls = serve();
    await mountWith(PeopleEditDialog, { user: userWith(['manager']), path: '/people', props: { personId: person.id } });
    await type(getByRole('textbox', 'Full name'), 'Marcus K. Boateng');
    getByRole('button', 'Save the changes').click();
    await settle();
    expect(calls.at(-1)).toMatchObject({ method: 'PATCH', body: { name: 'Marcus K. Boateng' } });
    expect(Object.keys(calls.at(-1)!.body as object)).toEqual(['name']);
  });

  it('when the account is switched off, then a reason is asked for and sent with it', async () => {
    const calls = serve();
    await mountWith(PeopleEditDialog, { user: userWith(['manager']), path: '/people', props: { personId: person.id } });
    (document.querySelector('input[type="checkbox"]') as HTMLInputElement).click();
    await settle();
    await type(getByRole('textbox', 'Reason for switching the account off'), 'Left the company on 30 June');
    getByRole('button', 'Save the changes').click();
    await settle();
    expect(calls.at(-1)).toMatchObject({ method: 'PATCH', body: { active: false, deactivatedReason: 'Left the company on 30 June' } });
  });
});
