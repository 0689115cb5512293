import type { z } from 'zod';
import { ApiError, apiErrorFrom } from '../../../lib/api-client';

/**
 * PUT with a JSON body, answered with JSON checked by `schema`. The shared API client has no PUT
 * yet (saving a study is the first endpoint that needs one); this follows its rules exactly:
 * same-origin cookies, the server's error body as an ApiError, the answer parsed by the shared
 * schema. A 401 here is handled by the caller's mutation (it re-checks the session).
 */
export async function putJson<T>(path: string, body: unknown, schema: z.ZodType<T>): Promise<T> {
  let response: Response;
  try {
    response = await fetch(path, {
      method: 'PUT',
      credentials: 'same-origin',
      headers: { Accept: 'application/json', 'Content-Type': 'application/json' },
      body: JSON.stringify(body),
    });
  } catch {
    throw new ApiError({ status: 0, code: 'network_error', message: 'Could not reach the Spoolbook server. Check your connection and try again.' });
  }
  const text = await response.text();
  let json: unknown = undefined;
  try {
    json = text.length > 0 ? JSON.parse(text) : undefined;
  } catch {
    json = undefined;
  }
  if (!response.ok) throw apiErrorFrom(response.status, json, response.headers.get('Retry-After'));
  const parsed = schema.safeParse(json);
  if (!parsed.success) {
    throw new ApiError({
      status: 0,
      code: 'unexpected_response',
      message: 'The server sent an answer this page does not understand. Reload the page and try again.',
      details: parsed.error.issues,
    });
  }
  return parsed.data;
}
