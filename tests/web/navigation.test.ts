import { afterEach, describe, expect, it, vi } from 'vitest';
import AppNavigation from '@/components/AppNavigation.vue';
import { fakeFetch, mountWith, queryAllByRole, userWith } from './support';
import type { Role } from '@shared/roles';

afterEach(() => {
  vi.unstubAllGlobals();
  document.body.innerHTML = '';
});

async function entriesFor(roles: Role[]): Promise<string[]> {
  fakeFetch(() => undefined);
  await mountWith(AppNavigation, { user: userWith(roles) });
  const nav = queryAllByRole('navigation', 'Main navigation')[0];
  return [...nav.querySelectorAll('a[href]')].map((a) => a.textContent!.trim());
}

describe('the navigation', () => {
  it('when a manager is signed in, then it offers People but not the outgoing mail', async () => {
    const entries = await entriesFor(['manager']);
    expect(entries).toContain('People');
    expect(entries).not.toContain('Outgoing mail');
  });

  it('when a technician is signed in, then it offers neither People nor the outgoing mail', async () => {
    const entries = await entriesFor(['technician']);
    expect(entries).toEqual(expect.arrayContaining(['Home', 'Your account']));
    expect(entries).not.toContain('People');
    expect(entries).not.toContain('Outgoing mail');
  });

  it('when an admin is signed in, then it offers People and the outgoing mail', async () => {
    const entries = await entriesFor(['admin']);
    expect(entries).toEqual(expect.arrayContaining(['People', 'Outgoing mail']));
  });

  it('when an auditor is signed in, then it leaves out the pages that change people and the mail', async () => {
    const entries = await entriesFor(['auditor']);
    expect(entries).not.toContain('People');
    expect(entries).not.toContain('Outgoing mail');
  });

  it('then each entry leads to its page', async () => {
    await entriesFor(['admin']);
    const link = queryAllByRole('link', 'People')[0] as HTMLAnchorElement;
    expect(new URL(link.href).pathname).toBe('/people');
  });
});
