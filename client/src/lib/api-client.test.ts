import { afterEach, describe, expect, it, vi } from 'vitest';
import { z } from 'zod';
import { ApiError, api, forgetCsrfToken, rememberCsrfToken } from './api-client';

type Call = { url: string; method: string; headers: Record<string, string>; body?: string };

function json(status: number, body: unknown): Response {
  return new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });
}

function fakeServer(answer: (call: Call, n: number) => Response) {
  const calls: Call[] = [];
  vi.stubGlobal(
    'fetch',
    vi.fn(async (url: string, init: RequestInit) => {
      const call = { url, method: init.method ?? 'GET', headers: init.headers as Record<string, string>, body: init.body as string | undefined };
      calls.push(call);
      return answer(call, calls.length);
    }),
  );
  return calls;
}

afterEach(() => {
  vi.unstubAllGlobals();
  forgetCsrfToken();
});

const ok = z.object({ ok: z.boolean() });

describe('api client', () => {
  it('sends the remembered CSRF token on writes, never on reads', async () => {
    rememberCsrfToken('tok-1');
    const calls = fakeServer(() => json(200, { ok: true }));
    await api.get('/api/x', ok);
    await api.post('/api/x', ok, { a: 1 });
    expect(calls[0].headers['X-CSRF-Token']).toBeUndefined();
    expect(calls[1].headers['X-CSRF-Token']).toBe('tok-1');
    expect(calls[1].body).toBe('{"a":1}');
  });

  it('fetches a token first when it has none', async () => {
    const calls = fakeServer((call) => (call.url === '/api/session' ? json(200, { user: null, csrfToken: 'fresh' }) : json(200, { ok: true })));
    await api.put('/api/x', ok, {});
    expect(calls.map((c) => `${c.method} ${c.url}`)).toEqual(['GET /api/session', 'PUT /api/x']);
    expect(calls[1].headers['X-CSRF-Token']).toBe('fresh');
  });

  it('renews a stale token once and retries the write', async () => {
    rememberCsrfToken('stale');
    const calls = fakeServer((call, n) => {
      if (call.url === '/api/session') return json(200, { user: null, csrfToken: 'renewed' });
      if (n === 1) return json(403, { error: 'auth.csrf', message: 'Stale token' });
      return json(200, { ok: true });
    });
    await expect(api.delete('/api/x', ok)).resolves.toEqual({ ok: true });
    expect(calls.map((c) => c.headers['X-CSRF-Token'] ?? '-')).toEqual(['stale', '-', 'renewed']);
  });

  it('does not retry a second CSRF refusal', async () => {
    rememberCsrfToken('stale');
    fakeServer((call) => (call.url === '/api/session' ? json(200, { user: null, csrfToken: 'also-bad' }) : json(403, { error: 'auth.csrf', message: 'No' })));
    await expect(api.post('/api/x', ok)).rejects.toMatchObject({ code: 'auth.csrf', status: 403 });
  });

  it('turns error bodies into ApiError with the server message and field messages', async () => {
    rememberCsrfToken('t');
    fakeServer(() => json(400, { error: 'request.invalid', message: 'Check the fields', fields: { 'name': 'Too short' } }));
    const error = await api.post('/api/x', ok, {}).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ApiError);
    expect(error).toMatchObject({ status: 400, code: 'request.invalid', message: 'Check the fields', fields: { name: 'Too short' } });
  });

  it('explains non-JSON failures and unexpected shapes in plain words', async () => {
    fakeServer((_c, n) => (n === 1 ? new Response('<html>Bad gateway</html>', { status: 502 }) : json(200, { nope: 1 })));
    await expect(api.get('/api/x', ok)).rejects.toMatchObject({ status: 502, code: 'server.internal' });
    const spy = vi.spyOn(console, 'error').mockImplementation(() => {});
    await expect(api.get('/api/x', ok)).rejects.toMatchObject({ code: 'response.invalid' });
    spy.mockRestore();
  });

  it('reports an unreachable server as a network error', async () => {
    vi.stubGlobal('fetch', vi.fn(async () => Promise.reject(new TypeError('Failed to fetch'))));
    await expect(api.get('/api/x', ok)).rejects.toMatchObject({ status: 0, code: 'network' });
  });

  it('returns nothing for 204 answers', async () => {
    rememberCsrfToken('t');
    fakeServer(() => new Response(null, { status: 204 }));
    await expect(api.put('/api/x', null, {})).resolves.toBeUndefined();
  });
});
