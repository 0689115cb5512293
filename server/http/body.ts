import type { Request, RequestHandler } from 'express';
import { HttpError, type FieldIssue } from './errors';

/** Largest JSON request body, bytes (1 MiB, as the API has always accepted). */
const JSON_BODY_LIMIT_BYTES = 1024 * 1024;
/** Deepest nesting of arrays and objects a JSON body may have; no API input comes near it. */
const JSON_MAX_DEPTH = 64;

export interface JsonBodyOptions {
  limitBytes?: number;
  maxDepth?: number;
}

/**
 * Reads and parses a JSON request body into `req.body`, like `express.json({ strict: true })`,
 * but refusing hostile bodies early and cleanly:
 * - a declared Content-Length over the limit answers 413 at once, before any of the body is read,
 *   and a streamed (chunked) body is cut off with 413 as soon as it passes the limit; either way
 *   the connection is closed, so the rest is never read;
 * - nesting deeper than `maxDepth` answers 400 before JSON.parse sees it;
 * - text with the NUL character or with half of a UTF-16 surrogate pair answers 400 naming the
 *   field: PostgreSQL cannot store either in text or jsonb, so letting them through would only
 *   fail later, deep in a route;
 * - only UTF-8 and no Content-Encoding (a compressed body could expand past every limit).
 * Requests without a JSON content type are left to their routes (multipart uploads).
 */
export function jsonBody({ limitBytes = JSON_BODY_LIMIT_BYTES, maxDepth = JSON_MAX_DEPTH }: JsonBodyOptions = {}): RequestHandler {
  return (req, _res, next) => {
    // req.is answers null when the request has no body at all, false for another content type.
    if (!req.is('application/json')) return next();

    const tooLarge = () => new HttpError(413, 'too_large', `The request body is larger than ${formatBytes(limitBytes)}.`, undefined, { Connection: 'close' });
    const declaredText = req.headers['content-length'];
    const declared = declaredText === undefined ? null : Number(declaredText);
    if (declared !== null && declared > limitBytes) return next(tooLarge());

    const encoding = (req.headers['content-encoding'] ?? 'identity').toLowerCase();
    if (encoding !== 'identity') {
      return next(new HttpError(415, 'unsupported_encoding', 'Send the JSON body uncompressed (no Content-Encoding).', undefined, { Connection: 'close' }));
    }
    const charset = charsetOf(req);
    if (charset !== null && charset !== 'utf-8' && charset !== 'utf8') {
      return next(
        new HttpError(415, 'unsupported_charset', `Send the JSON body as UTF-8 (charset ${charset} is not accepted).`, undefined, { Connection: 'close' }),
      );
    }

    const chunks: Buffer[] = [];
    let received = 0;
    let settled = false;
    const settle = (err?: unknown) => {
      if (settled) return;
      settled = true;
      req.off('data', onData);
      req.off('end', onEnd);
      req.off('error', onError);
      req.off('close', onClose);
      if (err !== undefined) next(err);
      else next();
    };
    const onData = (chunk: Buffer) => {
      received += chunk.length;
      if (received > limitBytes) {
        // Stop reading: the 413 closes the connection, so the client cannot make us read the rest.
        req.pause();
        settle(tooLarge());
        return;
      }
      chunks.push(chunk);
    };
    const onEnd = () => {
      if (declared !== null && received !== declared) {
        return settle(new HttpError(400, 'bad_request', 'The request body is shorter or longer than its Content-Length.'));
      }
      try {
        req.body = parseJsonText(Buffer.concat(chunks, received).toString('utf8'), maxDepth);
        settle();
      } catch (err) {
        settle(err);
      }
    };
    // The client went away or the server's request timeout cut it off: nobody is left to answer.
    const onError = () => {
      settled = true;
      req.off('data', onData);
      req.off('end', onEnd);
      req.off('close', onClose);
    };
    const onClose = () => {
      if (!req.complete) onError();
    };
    req.on('data', onData);
    req.on('end', onEnd);
    req.on('error', onError);
    req.on('close', onClose);
  };
}

function charsetOf(req: Request): string | null {
  const type = req.headers['content-type'] ?? '';
  const m = /;\s*charset\s*=\s*"?([^";\s]+)"?/i.exec(type);
  return m ? m[1].toLowerCase() : null;
}

function formatBytes(n: number) {
  return n % (1024 * 1024) === 0 ? `${n / 1024 / 1024} MB` : `${Math.round(n / 1024)} kB`;
}

/**
 * Parses a JSON body: an object or array at the top (like body-parser's strict mode), empty text as
 * `{}`, nesting no deeper than `maxDepth`, strings and keys free of NUL and lone surrogates.
 * Throws HttpError 400 with the error shape the API uses.
 */
function parseJsonText(text: string, maxDepth = JSON_MAX_DEPTH): unknown {
  const start = text.search(/\S/);
  if (start === -1) return {};
  const first = text[start];
  if (first !== '{' && first !== '[') throw new HttpError(400, 'malformed_json', 'The request body must be a JSON object.');
  const depth = nestingDepth(text, maxDepth);
  if (depth > maxDepth) {
    throw new HttpError(400, 'too_deep', `The request body nests arrays and objects more than ${maxDepth} levels deep.`);
  }
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch {
    throw new HttpError(400, 'malformed_json', 'The request body is not valid JSON.');
  }
  const issues = unstorableText(value);
  if (issues.length) {
    throw new HttpError(400, 'invalid_input', `Invalid request body: ${issues[0].path}: ${issues[0].message}`, { issues });
  }
  return value;
}

/**
 * The deepest nesting of `[` and `{` outside strings, counting stops once past `limit` so a
 * hostile body costs one linear scan and no recursion.
 */
function nestingDepth(text: string, limit = Infinity): number {
  let depth = 0;
  let deepest = 0;
  let inString = false;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (inString) {
      if (c === 0x5c)
        i++; // backslash: skip the escaped character
      else if (c === 0x22) inString = false;
      continue;
    }
    if (c === 0x22) inString = true;
    else if (c === 0x7b || c === 0x5b) {
      depth++;
      if (depth > deepest) {
        deepest = depth;
        if (deepest > limit) return deepest;
      }
    } else if (c === 0x7d || c === 0x5d) depth--;
  }
  return deepest;
}

const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

function textProblem(s: string): string | null {
  if (s.includes('\u0000')) return 'must not contain the NUL character (\\u0000)';
  if (LONE_SURROGATE.test(s)) return 'is not well-formed Unicode (half of a surrogate pair)';
  return null;
}

const MAX_REPORTED_ISSUES = 20;

/** Strings and keys PostgreSQL could not store, with their dotted paths. Iterative: depth is bounded already, but stay cheap. */
function unstorableText(root: unknown): FieldIssue[] {
  const issues: FieldIssue[] = [];
  const stack: { value: unknown; path: string[] }[] = [{ value: root, path: [] }];
  const pathText = (p: string[]) => p.join('.') || '(body)';
  while (stack.length && issues.length < MAX_REPORTED_ISSUES) {
    const { value, path } = stack.pop()!;
    if (typeof value === 'string') {
      const problem = textProblem(value);
      if (problem) issues.push({ path: pathText(path), message: problem });
    } else if (Array.isArray(value)) {
      for (let i = value.length - 1; i >= 0; i--) stack.push({ value: value[i], path: [...path, String(i)] });
    } else if (value !== null && typeof value === 'object') {
      for (const [key, v] of Object.entries(value)) {
        const problem = textProblem(key);
        // A bad key cannot be shown as it is: name it by its position instead.
        if (problem) issues.push({ path: pathText([...path, JSON.stringify(key).slice(1, -1)]), message: `key ${problem}` });
        else stack.push({ value: v, path: [...path, key] });
      }
    }
  }
  return issues;
}
