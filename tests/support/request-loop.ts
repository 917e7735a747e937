import { expect } from 'vitest';

export interface Seen {
  path: string;
  /** 0: no HTTP answer at all (the server gone or the request timed out). */
  status: number;
  retryAfter: string | null;
  body: unknown;
}

const PATHS = ['/api/session', '/api/health'];

async function get(base: string, cookie: string, path: string): Promise<Seen> {
  try {
    const res = await fetch(base + path, { headers: { cookie }, signal: AbortSignal.timeout(15_000) });
    const text = await res.text();
    let body: unknown = text;
    try {
      body = JSON.parse(text);
    } catch {
      /* not JSON: kept as text, and the checks below say so */
    }
    return { path, status: res.status, retryAfter: res.headers.get('retry-after'), body };
  } catch (err) {
    return { path, status: 0, retryAfter: null, body: String(err) };
  }
}

/** GET /api/session (with the cookie) and GET /api/health, over and over, until stop() (at most 4000 each). */
export function requestLoop(base: string, cookie: string) {
  const seen: Seen[] = [];
  let running = true;
  const done = (async () => {
    for (let i = 0; running && i < 4000; i++) {
      seen.push(...(await Promise.all(PATHS.map((p) => get(base, cookie, p)))));
      await new Promise((r) => setTimeout(r, 25));
    }
  })();
  return {
    seen,
    /** Bounded wait until `more` further rounds have been answered. */
    async rounds(more: number) {
      const until = seen.length + more * PATHS.length;
      for (let i = 0; i < 600 && seen.length < until && running; i++) await new Promise((r) => setTimeout(r, 50));
    },
    async stop() {
      running = false;
      await done;
      return seen;
    },
  };
}

/** Every answer was a success or the database's 503 (JSON, Retry-After); the last of each path a success. */
export function expectOnlySuccessOr503(seen: Seen[]) {
  for (const s of seen) {
    if (s.status === 200) continue;
    const what = `${s.path}: ${s.status} ${JSON.stringify(s.body)}`;
    expect(s.status, what).toBe(503);
    if (s.path === '/api/health') expect(s.body, what).toEqual({ status: 'degraded', database: 'down' });
    else {
      expect(s.retryAfter, what).toBe('5');
      expect((s.body as { error?: { code?: string } }).error?.code, what).toBe('database_unavailable');
    }
  }
  for (const p of PATHS) expect(seen.filter((s) => s.path === p).at(-1)?.status, `last ${p}`).toBe(200);
}
