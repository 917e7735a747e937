import { afterEach, describe, expect, it, vi } from 'vitest';
import { createPinia, setActivePinia } from 'pinia';
import { createMemoryHistory } from 'vue-router';
import type { SessionUser } from '@shared/schemas/auth';
import { createAppRouter } from '@/router';
import { useSessionStore } from '@/stores/session';
import { fakeFetch, userWith } from './support';

afterEach(() => vi.unstubAllGlobals());

async function arriveAt(path: string, user: SessionUser | null) {
  setActivePinia(createPinia());
  useSessionStore().setUser(user);
  const router = createAppRouter(createMemoryHistory());
  await router.push(path);
  return router.currentRoute.value;
}

describe('the router guards', () => {
  it('when nobody is signed in, then a page asks for sign-in and remembers where it was going', async () => {
    const route = await arriveAt('/people?q=anna', null);
    expect(route.name).toBe('sign-in');
    expect(route.query.redirect).toBe('/people?q=anna');
  });

  it('when a technician opens the people page, then they are sent home', async () => {
    expect((await arriveAt('/people', userWith(['technician']))).name).toBe('home');
  });

  it('when a manager opens the people page, then it opens', async () => {
    expect((await arriveAt('/people', userWith(['manager']))).name).toBe('people');
  });

  it('when a manager opens the outgoing mail, then they are sent home; an admin gets in', async () => {
    expect((await arriveAt('/outbox', userWith(['manager']))).name).toBe('home');
    expect((await arriveAt('/outbox', userWith(['admin']))).name).toBe('outbox');
  });

  it('when someone signed in opens the sign-in page, then they go home instead', async () => {
    expect((await arriveAt('/sign-in', userWith(['auditor']))).name).toBe('home');
  });

  it('when the page first loads, then the server is asked who is signed in', async () => {
    const calls = fakeFetch((c) => (c.url.pathname === '/api/session' ? { body: userWith(['admin']) } : undefined));
    setActivePinia(createPinia());
    const router = createAppRouter(createMemoryHistory());
    await router.push('/outbox');
    expect(calls.map((c) => c.url.pathname)).toEqual(['/api/session']);
    expect(router.currentRoute.value.name).toBe('outbox');
  });
});
