import { afterEach, describe, expect, it, vi } from 'vitest';
import { api, isApiError, setUnauthorizedHandler } from '@/api';
import { fakeFetch } from './support';

afterEach(() => {
  vi.unstubAllGlobals();
  setUnauthorizedHandler(() => {});
});

describe('the HTTP client', () => {
  it('when the session has lapsed, then the one 401 handler runs', async () => {
    fakeFetch(() => ({ status: 401, body: { error: { code: 'unauthorized', message: 'Sign in first.' } } }));
    const handler = vi.fn();
    setUnauthorizedHandler(handler);
    await expect(api.get('/people')).rejects.toSatisfy(isApiError);
    expect(handler).toHaveBeenCalledOnce();
  });

  it('when sign-in is refused, then the handler stays quiet and the error carries the server message', async () => {
    fakeFetch(() => ({ status: 401, body: { error: { code: 'bad_credentials', message: 'E-mail or password is not right.' } } }));
    const handler = vi.fn();
    setUnauthorizedHandler(handler);
    const error = await api.post('/session', { email: 'a@b.test', password: 'x' }).catch((e: unknown) => e);
    expect(isApiError(error) && [error.code, error.message]).toEqual(['bad_credentials', 'E-mail or password is not right.']);
    expect(handler).not.toHaveBeenCalled();
  });

  it('then writes go same-origin with cookies and a JSON body, and empty query values are left out', async () => {
    const fetchMock = vi.fn(async (_url: string, _init?: RequestInit) => new Response(null, { status: 204 }));
    vi.stubGlobal('fetch', fetchMock);
    await api.patch('/people/x', { name: 'N' });
    await api.get('/people', { page: 1, q: '', role: undefined });
    expect(fetchMock.mock.calls[0]).toEqual(['/api/people/x', expect.objectContaining({ method: 'PATCH', credentials: 'same-origin', body: '{"name":"N"}' })]);
    expect(fetchMock.mock.calls[1][0]).toBe('/api/people?page=1');
  });

  it('when the server cannot be reached, then the error says so', async () => {
    vi.stubGlobal('fetch', vi.fn(async () => { throw new TypeError('Failed to fetch'); }));
    const error = await api.get('/health').catch((e: unknown) => e);
    expect(isApiError(error) && error.code).toBe('network');
  });
});
