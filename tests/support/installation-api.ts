// Plain fetch against a running installation (no supertest: it is another process), with the Origin
// header a browser sends, so writes pass the same-origin check.
import { expect } from 'vitest';
import { DEMO_PASSWORD } from '../../server/seed/demo-people.js';

export async function signIn(base: string, email: string): Promise<string> {
  const res = await fetch(`${base}/api/session`, { method: 'POST', headers: { 'content-type': 'application/json', origin: base }, body: JSON.stringify({ email, password: DEMO_PASSWORD }) });
  expect(res.status, await res.clone().text()).toBe(200);
  return res.headers.get('set-cookie')!.split(';')[0];
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function api(base: string, cookie: string, method: string, url: string, body?: unknown): Promise<any> {
  const headers: Record<string, string> = { cookie, origin: base };
  if (body !== undefined) headers['content-type'] = 'application/json';
  const res = await fetch(`${base}${url}`, { method, headers, body: body === undefined ? undefined : JSON.stringify(body) });
  const text = await res.text();
  expect(res.ok, `${method} ${url}: ${res.status} ${text}`).toBe(true);
  return text ? JSON.parse(text) : undefined;
}

/** Uploads a CSV instrument export as the signed-in person's own evidence. */
export async function uploadCsv(base: string, cookie: string, bytes: Buffer, fileName: string): Promise<{ id: string }> {
  const form = new FormData();
  form.append('caption', 'kept through a backup');
  form.append('file', new Blob([new Uint8Array(bytes)], { type: 'text/csv' }), fileName);
  const res = await fetch(`${base}/api/evidence`, { method: 'POST', headers: { cookie, origin: base }, body: form });
  const text = await res.text();
  expect(res.status, text).toBe(201);
  return JSON.parse(text);
}
