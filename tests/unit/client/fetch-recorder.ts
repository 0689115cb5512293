import { vi } from 'vitest';

export interface RecordedRequest {
  method: string;
  url: string;
  /** The JSON body sent, parsed; undefined without one. */
  body: unknown;
}

/**
 * Replaces `fetch` with a recorder for client component tests: every request is kept in the
 * returned list, in order, and `answer` says what comes back (as docs/api.md says the server
 * answers). Null leaves the request pending: refetches a test does not look at never land.
 * Undo with `vi.unstubAllGlobals()`.
 */
export function recordFetch(answer: (request: RecordedRequest) => Response | null = () => null): RecordedRequest[] {
  const requests: RecordedRequest[] = [];
  vi.stubGlobal(
    'fetch',
    vi.fn(async (url: string, init: RequestInit = {}) => {
      const request = { method: init.method ?? 'GET', url, body: typeof init.body === 'string' ? JSON.parse(init.body) : undefined };
      requests.push(request);
      return answer(request) ?? new Promise<Response>(() => undefined);
    }),
  );
  return requests;
}

/** A JSON answer with the given status. */
export function json(status: number, body: unknown): Response {
  return new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });
}
