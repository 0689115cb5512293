import { QueryClient } from '@tanstack/react-query';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { z } from 'zod';
import { meSchema } from '#shared/schemas/account';
import { ApiError, api, apiErrorFrom } from '#src/lib/api-client';
import { installSessionExpiry, meQueryOptions } from '#src/lib/session';

// The one unit test that replaces fetch: it checks how the client reads answers, not the server.
function answer(status: number, body?: unknown, headers: Record<string, string> = {}) {
  return vi.fn(
    async () => new Response(body === undefined ? null : JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json', ...headers } }),
  );
}

const me = {
  user: { id: 'u1', email: 'demo@spoolbook.test', name: 'Demo', isAdmin: false, unitSystem: 'si', emailConfirmed: true, twoFactor: false },
  teams: [],
};

afterEach(() => {
  vi.unstubAllGlobals();
});

describe('api client errors', () => {
  it('turns an invalid_input body into field errors keyed by dotted path, first message per path', async () => {
    vi.stubGlobal(
      'fetch',
      answer(400, {
        error: {
          code: 'invalid_input',
          message: 'Invalid request body: email: must be an e-mail address',
          details: {
            issues: [
              { path: 'email', message: 'must be an e-mail address' },
              { path: 'email', message: 'must be at most 254 characters' },
              { path: 'engine.displacement', message: 'must be positive' },
            ],
          },
        },
      }),
    );
    const error = await api.post('/api/auth/sign-up', { email: 'x' }).catch((caught: unknown) => caught);
    expect(error).toBeInstanceOf(ApiError);
    const apiError = error as ApiError;
    expect(apiError.status).toBe(400); // HTTP 400 Bad Request, RFC 9110 §15.5.1; docs/api.md for invalid_input
    expect(apiError.code).toBe('invalid_input');
    expect(apiError.message).toBe('Invalid request body: email: must be an e-mail address');
    expect(apiError.fieldErrors).toEqual({
      email: 'must be an e-mail address',
      'engine.displacement': 'must be positive',
    });
  });

  it('keeps a plain message when the body is not our error shape (a proxy page, say)', () => {
    const error = apiErrorFrom(502, undefined); // HTTP 502 Bad Gateway, RFC 9110 §15.6.3
    expect(error.code).toBe('http_error');
    expect(error.message).toContain('502');
    expect(error.fieldErrors).toEqual({});
  });

  it('reads Retry-After seconds from a 429 answer', async () => {
    vi.stubGlobal('fetch', answer(429, { error: { code: 'rate_limited', message: 'Too many tries.' } }, { 'Retry-After': '30' }));
    const error = (await api.post('/api/auth/sign-in', {}).catch((caught: unknown) => caught)) as ApiError;
    expect(error.status).toBe(429); // HTTP 429 Too Many Requests, RFC 6585 §4
    expect(error.retryAfterSeconds).toBe(30); // the header value sent above
  });

  it('reports a network failure as status 0 with a readable message', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => Promise.reject(new TypeError('Failed to fetch'))),
    );
    const error = (await api.get('/api/teams', z.object({})).catch((caught: unknown) => caught)) as ApiError;
    expect(error.status).toBe(0); // the client's own convention for "no HTTP answer", no source
    expect(error.code).toBe('network_error');
    expect(error.message).toMatch(/could not reach/i);
  });
});

describe('api client requests and answers', () => {
  it('sends JSON with the session cookie and parses the answer with the given schema', async () => {
    const fetchMock = answer(200, me);
    vi.stubGlobal('fetch', fetchMock);
    const result = await api.post('/api/auth/sign-in', { email: 'demo@spoolbook.test', password: 'spoolbook-demo' }, meSchema);
    expect(result.user.email).toBe('demo@spoolbook.test');
    const [url, init] = fetchMock.mock.calls[0] as unknown as [string, RequestInit];
    expect(url).toBe('/api/auth/sign-in');
    expect(init.method).toBe('POST');
    expect(init.credentials).toBe('same-origin');
    expect((init.headers as Record<string, string>)['Content-Type']).toBe('application/json');
    expect(JSON.parse(init.body as string)).toEqual({ email: 'demo@spoolbook.test', password: 'spoolbook-demo' });
  });

  it('refuses an answer that does not match the schema instead of passing it on', async () => {
    vi.stubGlobal('fetch', answer(200, { user: { id: 'u1' } }));
    const error = (await api.get('/api/auth/me', meSchema).catch((caught: unknown) => caught)) as ApiError;
    expect(error).toBeInstanceOf(ApiError);
    expect(error.code).toBe('unexpected_response');
  });

  it('resolves a 204 answer without a body to undefined', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => new Response(null, { status: 204 })),
    ); // HTTP 204 No Content, RFC 9110 §15.3.5
    await expect(api.post('/api/auth/sign-out')).resolves.toBeUndefined();
  });
});

describe('session expiry', () => {
  let queryClient: QueryClient;
  let uninstall: () => void;
  beforeEach(() => {
    queryClient = new QueryClient();
    uninstall = installSessionExpiry(queryClient);
    queryClient.setQueryData(meQueryOptions().queryKey, meSchema.parse(me));
    queryClient.setQueryData(['teams'], [{ id: 't1', name: 'Hill-climb', personal: false, role: 'owner' }]);
  });
  afterEach(() => uninstall());

  it('forgets the signed-in user and their cached data on a 401 unauthorized', async () => {
    vi.stubGlobal('fetch', answer(401, { error: { code: 'unauthorized', message: 'Sign in to continue.' } })); // HTTP 401, RFC 9110 §15.5.2
    await api.get('/api/teams', z.unknown()).catch(() => undefined);
    expect(queryClient.getQueryData(meQueryOptions().queryKey)).toBeNull();
    expect(queryClient.getQueryData(['teams'])).toBeUndefined();
  });

  it('keeps the session on a 401 for wrong credentials (a failed password check, not an expired session)', async () => {
    vi.stubGlobal('fetch', answer(401, { error: { code: 'invalid_credentials', message: 'Wrong e-mail or password.' } }));
    await api.post('/api/auth/sign-in', {}).catch(() => undefined);
    expect(queryClient.getQueryData(meQueryOptions().queryKey)).not.toBeNull();
  });
});
