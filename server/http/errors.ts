import type { ErrorRequestHandler, RequestHandler } from 'express';
import type { ZodType, z } from 'zod';
import { issuePath } from '#shared/schemas/issue-path';

/** An error meant for the client: status, a stable code, a plain message and optional details. */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details?: unknown,
    readonly headers?: Record<string, string>,
  ) {
    super(message);
  }
}

export const notFound = (what = 'Not found') => new HttpError(404, 'not_found', what);
export const forbidden = (message = 'You do not have permission to do that.') => new HttpError(403, 'forbidden', message);
export const unauthorized = (message = 'Sign in to continue.') => new HttpError(401, 'unauthorized', message);

export interface FieldIssue {
  path: string;
  message: string;
}

/** Turns zod issues into `{ path, message }` pairs with dotted paths such as `engine.displacement`. */
export function issuesOf(error: z.ZodError): FieldIssue[] {
  return error.issues.map((issue) => ({
    path: issuePath(issue.path, '(body)'),
    message: issue.message,
  }));
}

/** Parses a value with a zod schema or throws a 400 naming every bad field. */
export function parseOr400<T>(schema: ZodType<T>, value: unknown, what = 'request body'): T {
  const result = schema.safeParse(value);
  if (!result.success) {
    const issues = issuesOf(result.error);
    const first = issues[0];
    throw new HttpError(400, 'invalid_input', `Invalid ${what}: ${first.path}: ${first.message}`, { issues });
  }
  return result.data;
}

export const notFoundHandler: RequestHandler = (_req, _res, next) => {
  next(new HttpError(404, 'not_found', 'No such API route.'));
};

// Connection refused or reset, and PostgreSQL's admin-shutdown / cannot-connect-now / connection-failure codes.
const UNAVAILABLE_CODES = new Set(['ECONNREFUSED', 'ECONNRESET', 'EPIPE', 'ETIMEDOUT', '57P01', '57P02', '57P03', '08000', '08001', '08003', '08006']);

/** Is this error (or its cause) the database being down, restarting or unreachable? Start-up retries on these. */
export function isDatabaseUnavailable(err: unknown): boolean {
  if (!err || typeof err !== 'object') return false;
  const code = (err as { code?: unknown }).code;
  if (typeof code === 'string' && UNAVAILABLE_CODES.has(code)) return true;
  const message = (err as { message?: unknown }).message;
  if (typeof message === 'string' && /Connection terminated|timeout exceeded when trying to connect|is not queryable/i.test(message)) return true;
  const cause = (err as { cause?: unknown }).cause;
  return cause !== undefined && cause !== err && isDatabaseUnavailable(cause);
}

/**
 * PostgreSQL's data exceptions (SQLSTATE class 22: text with NUL, a number out of range, a value
 * the column cannot hold). Only the request can have put such a value there, so it is the
 * client's input, not a server fault. Routes should refuse these values first; this is the net.
 */
function databaseDataException(err: unknown, seen = 0): string | null {
  if (!err || typeof err !== 'object' || seen > 5) return null;
  const code = (err as { code?: unknown }).code;
  if (typeof code === 'string' && /^22[0-9A-Z]{3}$/.test(code)) return code;
  const cause = (err as { cause?: unknown }).cause;
  return cause !== undefined && cause !== err ? databaseDataException(cause, seen + 1) : null;
}

/** The one error handler: known errors keep their status; anything else is logged and answered 500 without details. */
export function errorHandler(log: { error: (obj: unknown, msg?: string) => void }): ErrorRequestHandler {
  return (err, req, res, _next) => {
    let httpError: HttpError;
    if (err instanceof HttpError) {
      httpError = err;
    } else if (err && typeof err === 'object' && 'type' in err && (err as { type: string }).type === 'entity.too.large') {
      httpError = new HttpError(413, 'too_large', 'The request body is too large.');
    } else if (err && typeof err === 'object' && 'type' in err && (err as { type: string }).type === 'entity.parse.failed') {
      httpError = new HttpError(400, 'malformed_json', 'The request body is not valid JSON.');
    } else if (
      err &&
      typeof err === 'object' &&
      'status' in err &&
      typeof (err as { status: unknown }).status === 'number' &&
      (err as { status: number }).status >= 400 &&
      (err as { status: number }).status < 500
    ) {
      const status = (err as { status: number }).status;
      httpError = new HttpError(status, 'bad_request', status === 413 ? 'The request body is too large.' : 'The request could not be read.');
    } else if (isDatabaseUnavailable(err)) {
      log.error({ err: { message: (err as Error).message, code: (err as { code?: string }).code }, url: req.originalUrl }, 'database unavailable');
      httpError = new HttpError(503, 'unavailable', 'The database is not reachable right now. Try again in a few seconds.', undefined, { 'Retry-After': '5' });
    } else if (databaseDataException(err)) {
      const code = databaseDataException(err);
      // Logged as an error all the same: the route let a value through that it should have refused.
      log.error({ err: { message: (err as Error).message, code }, url: req.originalUrl }, 'input the database refused reached it');
      httpError = new HttpError(
        400,
        'invalid_input',
        'A value in the request cannot be stored (for example text with a NUL character, or a number out of range).',
      );
    } else {
      log.error({ err, url: req.originalUrl }, 'unhandled error');
      httpError = new HttpError(500, 'internal', 'Something went wrong on our side. It has been logged.');
    }
    if (res.headersSent) {
      // Half an answer is out already: the only honest thing left is to cut the connection.
      req.socket.destroy();
      return;
    }
    if (httpError.headers) res.set(httpError.headers);
    const body: { error: { code: string; message: string; details?: unknown } } = {
      error: { code: httpError.code, message: httpError.message },
    };
    if (httpError.details !== undefined) body.error.details = httpError.details;
    res.status(httpError.status).json(body);
  };
}
