import type { z } from 'zod';
import { apiErrorSchema, fieldIssuesSchema } from '#shared/schemas/common';

/**
 * An API failure as the client sees it: the HTTP status (0 when the server could not be
 * reached or answered something unreadable), the server's stable code, a sentence for people
 * and the field errors keyed by dotted path (`engine.displacement`), first message per path.
 */
export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly fieldErrors: Record<string, string>;
  readonly details: unknown;
  /** Seconds to wait before retrying, from `Retry-After` on 429 answers. */
  readonly retryAfterSeconds: number | null;

  constructor(init: {
    status: number;
    code: string;
    message: string;
    fieldErrors?: Record<string, string>;
    details?: unknown;
    retryAfterSeconds?: number | null;
  }) {
    super(init.message);
    this.name = 'ApiError';
    this.status = init.status;
    this.code = init.code;
    this.fieldErrors = init.fieldErrors ?? {};
    this.details = init.details;
    this.retryAfterSeconds = init.retryAfterSeconds ?? null;
  }
}

export function isApiError(error: unknown): error is ApiError {
  return error instanceof ApiError;
}

/** Codes answered with 401 that mean "these credentials are wrong", not "your session ended". */
const CREDENTIAL_CODES = new Set(['invalid_credentials']);

/** The answer of a team that asks its members for a second factor the user has not turned on. */
export function isTwoFactorRequired(error: unknown): error is ApiError {
  return isApiError(error) && error.status === 403 && error.code === 'two_factor_required';
}

type ErrorListener = (error: ApiError) => void;
const unauthorizedListeners = new Set<ErrorListener>();
const twoFactorListeners = new Set<ErrorListener>();

function subscribe(listeners: Set<ErrorListener>, listener: ErrorListener): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

/**
 * Called whenever the server says the session is gone, so the app can forget the signed-in
 * user in one place (the router then sends the user to sign-in). Returns an unsubscribe.
 */
export function onUnauthorized(listener: ErrorListener): () => void {
  return subscribe(unauthorizedListeners, listener);
}

/**
 * Called whenever a team refuses its data for want of a second factor, wherever the request came
 * from, so the app can tell the member in one place how to get back in. Returns an unsubscribe.
 */
export function onTwoFactorRequired(listener: ErrorListener): () => void {
  return subscribe(twoFactorListeners, listener);
}

/** Turns an error body into an ApiError; bodies that are not ours still give a plain message. */
export function apiErrorFrom(status: number, body: unknown, retryAfter: string | null = null): ApiError {
  const retryAfterSeconds = retryAfter !== null && /^\d+$/.test(retryAfter.trim()) ? Number(retryAfter) : null;
  const parsed = apiErrorSchema.safeParse(body);
  if (!parsed.success) {
    return new ApiError({
      status,
      code: 'http_error',
      message: `The server answered with an error (${status}). Try again in a moment.`,
      retryAfterSeconds,
    });
  }
  const { code, message, details } = parsed.data.error;
  const fieldErrors: Record<string, string> = {};
  const issues = fieldIssuesSchema.safeParse(details);
  if (issues.success) {
    for (const issue of issues.data.issues) {
      // The first message per field is the one worth reading; later ones repeat the problem.
      if (!(issue.path in fieldErrors)) fieldErrors[issue.path] = issue.message;
    }
  }
  return new ApiError({ status, code, message, fieldErrors, details, retryAfterSeconds });
}

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

async function request<T>(method: Method, path: string, body: unknown, schema: z.ZodType<T> | null | 'bytes'): Promise<T> {
  const headers: Record<string, string> = { Accept: 'application/json' };
  const init: RequestInit = { method, headers, credentials: 'same-origin' };
  if (body instanceof FormData) {
    // multipart/form-data: the browser sets the Content-Type with its boundary.
    init.body = body;
  } else if (method !== 'GET') {
    headers['Content-Type'] = 'application/json';
    if (body !== undefined) init.body = JSON.stringify(body);
  }

  let response: Response;
  try {
    response = await fetch(path, init);
  } catch {
    throw new ApiError({
      status: 0,
      code: 'network_error',
      message: 'Could not reach the Spoolbook server. Check your connection and try again.',
    });
  }

  if (response.ok && schema === 'bytes') return (await response.arrayBuffer()) as T;
  const text = await response.text();
  let json: unknown = undefined;
  if (text.length > 0) {
    try {
      json = JSON.parse(text);
    } catch {
      json = undefined;
    }
  }

  if (!response.ok) {
    const error = apiErrorFrom(response.status, json, response.headers.get('Retry-After'));
    if (error.status === 401 && !CREDENTIAL_CODES.has(error.code)) {
      for (const listener of unauthorizedListeners) listener(error);
    }
    if (isTwoFactorRequired(error)) {
      for (const listener of twoFactorListeners) listener(error);
    }
    throw error;
  }

  if (schema === null || schema === 'bytes') return undefined as T;
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

/**
 * The one place that talks HTTP. Every answer with a body is parsed with the shared zod schema
 * named by the caller, so a response that drifts from the contract fails loudly here instead of
 * rendering half-empty screens.
 */
export const api = {
  get<T>(path: string, schema: z.ZodType<T>): Promise<T> {
    return request('GET', path, undefined, schema);
  },
  /** GETs a binary answer as its bytes (errors as for JSON). */
  bytes(path: string): Promise<ArrayBuffer> {
    return request<ArrayBuffer>('GET', path, undefined, 'bytes');
  },
  post<T = void>(path: string, body?: unknown, schema?: z.ZodType<T>): Promise<T> {
    return request('POST', path, body, schema ?? null);
  },
  put<T = void>(path: string, body: unknown, schema?: z.ZodType<T>): Promise<T> {
    return request('PUT', path, body, schema ?? null);
  },
  patch<T = void>(path: string, body: unknown, schema?: z.ZodType<T>): Promise<T> {
    return request('PATCH', path, body, schema ?? null);
  },
  /** POSTs files and fields as multipart/form-data (uploads); answers and errors as for JSON. */
  upload<T = void>(path: string, form: FormData, schema?: z.ZodType<T>): Promise<T> {
    return request('POST', path, form, schema ?? null);
  },
  delete<T = void>(path: string, schema?: z.ZodType<T>): Promise<T> {
    return request('DELETE', path, undefined, schema ?? null);
  },
};

/** Encodes one path segment (ids and tokens come from URLs and must not add segments). */
export function segment(value: string): string {
  return encodeURIComponent(value);
}
