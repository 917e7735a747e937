// Helpers for component tests: a real Vuetify, Pinia, router and ability; fetch replaced by a scripted fake.
import { h, nextTick, type Component } from 'vue';
import { flushPromises, mount } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import { abilitiesPlugin } from '@casl/vue';
import { createMemoryHistory } from 'vue-router';
import { VApp } from 'vuetify/components';
import { vi } from 'vitest';
import type { Role } from '@shared/roles';
import type { SessionUser } from '@shared/schemas/auth';
import { createAppVuetify } from '@/plugins/vuetify';
import { createAppRouter } from '@/router';
import { ability } from '@/plugins/ability';
import { useSessionStore } from '@/stores/session';

// happy-dom has no visualViewport; Vuetify's overlays (dialogs, menus) read it to place themselves.
if (!('visualViewport' in globalThis)) {
  const viewport = Object.assign(new EventTarget(), { width: 1280, height: 800, offsetLeft: 0, offsetTop: 0, pageLeft: 0, pageTop: 0, scale: 1 });
  Object.defineProperty(globalThis, 'visualViewport', { value: viewport, configurable: true });
}

export const LEIPZIG = { id: '00000000-0000-4000-8000-000000000001', code: 'LEJ-W1', name: 'Leipzig bench workshop', timeZone: 'Europe/Berlin', personTerm: 'skilled person' as const };
export const CLEVELAND = { id: '00000000-0000-4000-8000-000000000002', code: 'CLE-L2', name: 'Cleveland test lab', timeZone: 'America/New_York', personTerm: 'qualified person' as const };

export function userWith(roles: Role[], site: SessionUser['site'] = LEIPZIG): SessionUser {
  return { id: '10000000-0000-4000-8000-000000000001', email: 'pat@example.test', name: 'Pat Example', roles, site, siteIds: [site.id] };
}

export interface Call {
  method: string;
  url: URL;
  body: unknown;
}
type Reply = { status?: number; body?: unknown };
type Handler = (call: Call) => Reply | undefined;

/** Replaces fetch; `reply` answers each call (undefined → 404). Returns the list of calls made. */
export function fakeFetch(reply: Handler): Call[] {
  const calls: Call[] = [];
  vi.stubGlobal('fetch', vi.fn(async (input: string, init: RequestInit = {}) => {
    const call = { method: init.method ?? 'GET', url: new URL(input, 'http://localhost'), body: init.body ? JSON.parse(String(init.body)) : undefined };
    calls.push(call);
    const r = reply(call) ?? { status: 404, body: { error: { code: 'no_route', message: 'No route.' } } };
    const status = r.status ?? 200;
    return new Response(status === 204 ? null : JSON.stringify(r.body ?? {}), { status, headers: { 'Content-Type': 'application/json' } });
  }));
  return calls;
}

export const sitesReply = (call: Call): Reply | undefined => (call.url.pathname === '/api/sites' ? { body: [LEIPZIG, CLEVELAND] } : undefined);

/** Mounts `component` inside a v-app with the whole client set-up, signed in as `user` (or nobody). */
export async function mountWith(component: Component, opts: { user: SessionUser | null; path?: string; props?: Record<string, unknown> }) {
  const pinia = createPinia();
  setActivePinia(pinia);
  useSessionStore().setUser(opts.user);
  const router = createAppRouter(createMemoryHistory());
  await router.push(opts.path ?? '/');
  await router.isReady();
  const wrapper = mount({ render: () => h(VApp, () => h(component, opts.props)) }, {
    attachTo: document.body,
    global: { plugins: [pinia, router, createAppVuetify(), [abilitiesPlugin, ability]] },
  });
  await settle();
  return { wrapper, router };
}

export async function settle() {
  await flushPromises();
  await nextTick();
}

/** The accessible name, as far as these tests need it: aria-label, aria-labelledby, <label for>, or text. */
export function nameOf(el: Element): string {
  const aria = el.getAttribute('aria-label');
  if (aria) return aria.trim();
  const by = el.getAttribute('aria-labelledby');
  if (by) return by.split(' ').map((id) => document.getElementById(id)?.textContent ?? '').join(' ').trim();
  const label = el.id ? document.querySelector(`label[for="${el.id}"]`) : null;
  if (label) return (label.textContent ?? '').trim();
  return (el.textContent ?? '').replace(/\s+/g, ' ').trim();
}

const ROLE_SELECTORS: Record<string, string> = {
  button: 'button, [role="button"]',
  textbox: 'input:not([type]), input[type="text"], input[type="email"], input[type="password"], input[type="search"], textarea',
  link: 'a[href]',
  heading: 'h1, h2, h3, h4, h5, h6',
  navigation: 'nav',
};

export function queryAllByRole(role: string, name?: string | RegExp): HTMLElement[] {
  return [...document.querySelectorAll<HTMLElement>(ROLE_SELECTORS[role] ?? `[role="${role}"]`)].filter((el) => {
    if (name === undefined) return true;
    const n = nameOf(el);
    return typeof name === 'string' ? n === name : name.test(n);
  });
}

export function getByRole(role: string, name?: string | RegExp): HTMLElement {
  const found = queryAllByRole(role, name);
  if (found.length !== 1) throw new Error(`expected one ${role} named ${String(name)}, found ${found.length}`);
  return found[0];
}

/** Vuetify's alert boxes (its field messages carry role="alert" too, so they are told apart here). */
export function alertBoxes(): HTMLElement[] {
  return queryAllByRole('alert').filter((el) => el.classList.contains('v-alert'));
}

/** Types into an input the way a person does: value, then the input event Vue listens to. */
export async function type(input: HTMLElement, text: string) {
  (input as HTMLInputElement).value = text;
  input.dispatchEvent(new Event('input', { bubbles: true }));
  await settle();
}

/** The messages Vuetify shows under the input (its own v-input block). */
export function messagesBeside(input: HTMLElement): string {
  return (input.closest('.v-input')?.querySelector('.v-messages')?.textContent ?? '').trim();
}
