import { afterEach, describe, expect, it, vi } from 'vitest';
import HomeView from '@/views/HomeView.vue';
import { CLEVELAND, fakeFetch, getByRole, LEIPZIG, mountWith, queryAllByRole, sitesReply, userWith } from './support';

afterEach(() => {
  vi.unstubAllGlobals();
  document.body.innerHTML = '';
});

const home = (role: string) => document.querySelector(`[data-testid="home-${role}"]`);

describe('the home page', () => {
  it('when a technician at a European site signs in, then their home names them, the site and its person term, with the safety caution', async () => {
    fakeFetch(sitesReply);
    await mountWith(HomeView, { user: userWith(['technician'], LEIPZIG) });
    expect(home('technician')?.textContent).toContain('Pat Example');
    expect(home('technician')?.textContent).toContain('Leipzig bench workshop');
    expect(home('technician')?.textContent).toContain('skilled person');
    expect(getByRole('heading', 'Mains voltage can kill')).toBeTruthy();
  });

  it('when the site is in the US, then the person term is the one that site uses', async () => {
    fakeFetch(sitesReply);
    await mountWith(HomeView, { user: userWith(['technician'], CLEVELAND) });
    expect(home('technician')?.textContent).toContain('qualified person');
    expect(home('technician')?.textContent).not.toContain('skilled person');
  });

  it('when a manager signs in, then the manager home shows, without the bench caution, with a card for People', async () => {
    fakeFetch(sitesReply);
    await mountWith(HomeView, { user: userWith(['manager']) });
    expect(home('manager')).not.toBeNull();
    expect(queryAllByRole('heading', 'Mains voltage can kill')).toHaveLength(0);
    expect(queryAllByRole('link', /^People/)).toHaveLength(1);
  });

  it('when a person holds two roles, then the wider one shows first and the other is one click away', async () => {
    fakeFetch(sitesReply);
    const { router } = await mountWith(HomeView, { user: userWith(['technician', 'assessor']) });
    expect(home('assessor')).not.toBeNull();
    await router.push({ name: 'home', query: { as: 'technician' } });
    await vi.waitFor(() => expect(home('technician')).not.toBeNull());
  });

  it.each(['auditor', 'admin'] as const)('when an %s signs in, then their own home shows', async (role) => {
    fakeFetch(sitesReply);
    await mountWith(HomeView, { user: userWith([role]) });
    expect(home(role)).not.toBeNull();
  });
});
