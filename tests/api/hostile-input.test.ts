/**
 * Hostile input against a real listener (server/index.ts startServer, short timeouts passed in):
 * fast-check generates compute requests, study documents and map files that are valid, nearly
 * valid (one field mutated, retyped, removed or added) or garbage. The server never answers 500,
 * never stores an invalid study, and the engine never gives NaN or Infinity. Then the classic
 * attacks one by one: deep nesting, huge and odd numbers, unicode in names, a 20 MB body, slow
 * clients.
 */
import fc from 'fast-check';
import { readdirSync, readFileSync } from 'node:fs';
import net from 'node:net';
import path from 'node:path';
import pino from 'pino';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { users } from '#server/db/schema';
import { loadConfig } from '#server/config';
import { startServer, type RunningServer } from '#server/index';
import { builtinMaps } from '#server/services/builtin-maps';
import { parseMapFile } from '#shared/maps';
import { runComputeRequest } from '#shared/compute/run';
import { computeRequestSchema } from '#shared/schemas/compute';
import { studyDocumentSchema } from '#shared/schemas/study';
import { runStudyDocument } from '#shared/study/run';
import { expectErrorShape, ORIGIN, PASSWORD, uniqueEmail } from './helpers';

const root = path.resolve(import.meta.dirname, '..', '..');
const demo = JSON.parse(readFileSync(path.join(root, 'data', 'demo', 'hillclimb-study.json'), 'utf8'));
const builtinById = Object.fromEntries(builtinMaps().map((b) => [b.id, b.map]));

/** Short timeouts so slow-client tests take seconds (server/config.ts REQUEST_TIMEOUT_MS, HEADERS_TIMEOUT_MS). */
const REQUEST_TIMEOUT_MS = 2_000;
const HEADERS_TIMEOUT_MS = 1_000;

interface LogLine {
  level: number;
  msg: string;
  url?: string;
  err?: { message?: string; code?: string };
}
const logs: LogLine[] = [];
let server: RunningServer;
let base: string;
let cookie: string;
let teamId: string;

interface Answer {
  status: number;
  headers: Headers;
  text: string;
  body: any; // eslint-disable-line @typescript-eslint/no-explicit-any
}

async function send(method: string, url: string, body?: string | FormData, contentType = 'application/json', withCookie = true): Promise<Answer> {
  const headers: Record<string, string> = { Origin: ORIGIN };
  if (typeof body === 'string') headers['Content-Type'] = contentType;
  if (withCookie) headers.Cookie = cookie;
  const res = await fetch(base + url, { method, headers, body });
  const text = await res.text();
  let parsed: unknown = null;
  try {
    parsed = JSON.parse(text);
  } catch {
    // not JSON
  }
  return { status: res.status, headers: res.headers, text, body: parsed };
}
const sendJson = (method: string, url: string, value: unknown, withCookie = true) => send(method, url, JSON.stringify(value), 'application/json', withCookie);

/** Every number in `value` that is NaN or ±Infinity, by path (JSON has none, so this is for in-process results). */
function nonFinite(value: unknown): string[] {
  const found: string[] = [];
  const stack: [unknown, string][] = [[value, '']];
  while (stack.length) {
    const [v, p] = stack.pop()!;
    if (typeof v === 'number' && !Number.isFinite(v)) found.push(`${p}=${v}`);
    else if (Array.isArray(v)) v.forEach((x, i) => stack.push([x, `${p}.${i}`]));
    else if (v && typeof v === 'object') for (const [k, x] of Object.entries(v)) stack.push([x, `${p}.${k}`]);
  }
  return found;
}

/** Paths of JSON nulls: a NaN or Infinity that JSON.stringify turned into null on the way out. */
function nullsIn(value: unknown): string[] {
  const found: string[] = [];
  const stack: [unknown, string][] = [[value, '']];
  while (stack.length) {
    const [v, p] = stack.pop()!;
    if (v === null) found.push(p);
    else if (Array.isArray(v)) v.forEach((x, i) => stack.push([x, `${p}.${i}`]));
    else if (v && typeof v === 'object') for (const [k, x] of Object.entries(v)) stack.push([x, `${p}.${k}`]);
  }
  return found;
}

beforeAll(async () => {
  if (!process.env.DATABASE_URL) throw new Error('DATABASE_URL is not set: run the API tests through `npm test`.');
  const config = loadConfig({
    ...process.env,
    PORT: '0',
    HOST: '127.0.0.1',
    PUBLIC_URL: ORIGIN,
    FAKE_SMTP_PORT: '0',
    REQUEST_TIMEOUT_MS: String(REQUEST_TIMEOUT_MS),
    HEADERS_TIMEOUT_MS: String(HEADERS_TIMEOUT_MS),
  });
  // Warnings and errors are kept: a request the net in server/http/errors.ts caught is a route's bug.
  const logger = pino({ level: 'warn' }, { write: (line: string) => void logs.push(JSON.parse(line) as LogLine) });
  server = await startServer(
    { ...config, authRateLimit: 1000, smtpUrl: null },
    { handleSignals: false, logger, computeRateLimitPerMinute: 100_000, limitSettings: { uploadsPerUser: 100_000 } },
  );
  base = server.address;
  const signUp = await sendJson('POST', '/api/auth/sign-up', { email: uniqueEmail('hostile'), password: PASSWORD, name: 'Hostile Tester' }, false);
  if (signUp.status !== 201) throw new Error(`sign-up: ${signUp.status} ${signUp.text}`);
  cookie = signUp.headers
    .getSetCookie()
    .map((c) => c.split(';')[0])
    .join('; ');
  teamId = signUp.body.teams[0].id;
  // As if the mailed confirmation link was opened: this account creates teams below.
  await server.database.db.update(users).set({ emailConfirmedAt: new Date() }).where(eq(users.id, signUp.body.user.id));
}, 60_000);

afterAll(async () => {
  // HOSTILE_LOG=<file> keeps what the server logged, for looking into a failure.
  if (process.env.HOSTILE_LOG) (await import('node:fs')).writeFileSync(process.env.HOSTILE_LOG, JSON.stringify(logs, null, 1));
  await server?.stop('test end');
});

// ——— generators ———

const finite = (min: number, max: number) => fc.double({ min, max, noNaN: true, noDefaultInfinity: true });

/** Values a careless or hostile client puts where a field should be. */
const hostileValue: fc.Arbitrary<unknown> = fc.oneof(
  fc.constantFrom(
    null,
    true,
    false,
    0,
    -0,
    -1,
    1e308,
    -1e308,
    5e-324,
    2 ** 53 + 1,
    '',
    '0',
    '0.002',
    '1e3',
    'NaN',
    'Infinity',
    [],
    {},
    '💥',
    '\u202Eevil',
    'e\u0301\u0301\u0301',
    '\u0000',
    '\uD800',
  ),
  fc.double(),
  fc.integer(),
  fc.string({ unit: 'binary', maxLength: 20 }),
  fc.jsonValue({ maxDepth: 2 }),
);

type Json = unknown;

/** Every path (list of keys) to a node of `value`, the root included. */
function pathsOf(value: Json, prefix: (string | number)[] = [], out: (string | number)[][] = []): (string | number)[][] {
  out.push(prefix);
  if (Array.isArray(value)) value.forEach((v, i) => pathsOf(v, [...prefix, i], out));
  else if (value && typeof value === 'object') for (const [k, v] of Object.entries(value)) pathsOf(v, [...prefix, k], out);
  return out;
}

function retyped(v: Json): Json {
  if (typeof v === 'number') return String(v);
  if (typeof v === 'string') return Number(v) || 1;
  if (typeof v === 'boolean') return v ? 1 : 0;
  if (Array.isArray(v)) return Object.fromEntries(v.map((x, i) => [String(i), x]));
  if (v && typeof v === 'object') return Object.values(v);
  return 'null';
}

type Mutation = { kind: 'replace'; value: unknown } | { kind: 'delete' } | { kind: 'extra'; key: string; value: unknown } | { kind: 'retype' };
const mutationArb: fc.Arbitrary<Mutation> = fc.oneof(
  fc.record({ kind: fc.constant('replace' as const), value: hostileValue }),
  fc.record({ kind: fc.constant('delete' as const) }),
  fc.record({
    kind: fc.constant('extra' as const),
    key: fc.oneof(fc.string({ maxLength: 12 }), fc.constantFrom('__proto__', 'constructor', 'isAdmin', 'id')),
    value: hostileValue,
  }),
  fc.record({ kind: fc.constant('retype' as const) }),
);

/** `value` with one node changed: the nearly valid input. */
function mutate(value: Json, pick: number, m: Mutation): Json {
  const copy = structuredClone(value);
  const paths = pathsOf(copy);
  const at = paths[pick % paths.length];
  if (at.length === 0) return m.kind === 'replace' ? m.value : m.kind === 'retype' ? retyped(copy) : copy;
  const parent = at.slice(0, -1).reduce<any>((node, k) => node[k], copy); // eslint-disable-line @typescript-eslint/no-explicit-any
  const key = at[at.length - 1];
  if (m.kind === 'replace') parent[key] = m.value;
  else if (m.kind === 'retype') parent[key] = retyped(parent[key]);
  else if (m.kind === 'delete') {
    if (Array.isArray(parent)) parent.splice(Number(key), 1);
    else delete parent[key];
  } else {
    const node = parent[key];
    if (node && typeof node === 'object' && !Array.isArray(node))
      Object.defineProperty(node, m.key, { value: m.value, enumerable: true, configurable: true, writable: true });
    else parent[key] = { [m.key]: m.value };
  }
  return copy;
}

const computePointArb = fc.record(
  {
    rpm: finite(500, 12_000),
    volumetricEfficiency: finite(0.3, 1.3),
    boost: finite(-60_000, 350_000),
    manifoldTemperature: finite(250, 420),
    compressorEfficiency: finite(0.4, 0.85),
  },
  { requiredKeys: ['rpm', 'volumetricEfficiency', 'boost', 'manifoldTemperature'] },
);
const validComputeArb = fc.record(
  {
    engine: fc.record({ displacement: finite(0.0003, 0.01), cylinders: fc.integer({ min: 1, max: 16 }), strokes: fc.constantFrom(2, 4) }),
    ambient: fc.oneof(
      fc.record({ pressure: finite(60_000, 110_000), temperature: finite(230, 330) }),
      fc.record({ altitude: finite(-300, 5_000), temperature: finite(230, 330) }, { requiredKeys: ['altitude'] }),
    ),
    losses: fc.record({ inlet: finite(0, 10_000), chargeCooler: finite(0, 30_000) }),
    turbochargers: fc.integer({ min: 1, max: 4 }),
    mapReference: fc.record({ temperature: finite(288, 300), pressure: finite(95_000, 101_325) }),
    fuel: fc.oneof(
      fc.record({ kind: fc.constant('petrol'), lambda: finite(0.7, 1.1), brakeThermalEfficiency: finite(0.2, 0.4), drivetrainLoss: finite(0, 0.3) }),
      fc.record({ kind: fc.constant('ethanol-blend'), ethanolPercent: finite(0, 100), lambda: finite(0.7, 1.1), bsfc: finite(6e-8, 1e-7) }),
      fc.record({ kind: fc.constant('methanol'), lambda: finite(0.6, 1.0) }),
    ),
    points: fc.array(computePointArb, { minLength: 1, maxLength: 12 }),
  },
  { requiredKeys: ['engine', 'ambient', 'points'] },
);

/** A study document from the demo with its numbers moved around plausible values. */
const validStudyArb = fc
  .record({
    displacement: finite(0.0008, 0.006),
    cylinders: fc.integer({ min: 2, max: 12 }),
    veScale: finite(0.8, 1.1),
    boostScale: finite(0.2, 1.6),
    ambientTemperature: finite(250, 320),
    turbochargers: fc.integer({ min: 1, max: 2 }),
    notes: fc.string({ maxLength: 200 }),
  })
  .map((v) => {
    const doc = structuredClone(demo);
    doc.engine.displacement = v.displacement;
    doc.engine.cylinders = v.cylinders;
    for (const row of doc.engine.volumetricEfficiency) row.value = Math.min(1.5, row.value * v.veScale);
    for (const s of doc.scenarios) {
      if (s.ambient.temperature !== undefined) s.ambient.temperature = v.ambientTemperature;
      for (const b of s.boostSchedule) for (const row of b.boost) row.value = Math.round(row.value * v.boostScale);
    }
    doc.plans[0].turbochargers = v.turbochargers;
    doc.notes = v.notes;
    return doc;
  });

// ——— compute ———

describe('generated compute requests', () => {
  async function check(input: unknown) {
    const res = await sendJson('POST', '/api/compute', input, false);
    expect(res.status, `${res.status} for ${JSON.stringify(input).slice(0, 400)}: ${res.text.slice(0, 300)}`).toBeLessThan(500);
    expect(res.status, 'rate limited: the test would check nothing').not.toBe(429);
    if (res.status === 200) {
      expect(nullsIn(res.body), 'NaN or Infinity sent as null').toEqual([]);
      // The same request through the engine in-process, where NaN and Infinity cannot hide.
      const parsed = computeRequestSchema.safeParse(input);
      expect(parsed.success).toBe(true);
      if (parsed.success) expect(nonFinite(runComputeRequest(parsed.data))).toEqual([]);
    } else {
      expectErrorShape(res.body);
    }
  }

  it('valid ones answer 200 (or 400 for points with no physical state) with finite numbers only', async () => {
    await fc.assert(fc.asyncProperty(validComputeArb, check), { numRuns: 60 });
  }, 60_000);

  it('nearly valid ones (one field replaced, retyped, removed or added) never answer 500', async () => {
    await fc.assert(
      fc.asyncProperty(validComputeArb, fc.nat(), mutationArb, async (input, pick, m) => check(mutate(input, pick, m))),
      { numRuns: 200 },
    );
  }, 60_000);

  it('garbage never answers 500', async () => {
    await fc.assert(fc.asyncProperty(fc.jsonValue({ maxDepth: 4 }), check), { numRuns: 60 });
  }, 60_000);
});

// ——— studies ———

describe('generated study documents', () => {
  let study: { id: string; revision: number };

  beforeAll(async () => {
    const created = await sendJson('POST', `/api/teams/${teamId}/studies`, { title: 'Hostile saves', document: demo });
    if (created.status !== 201) throw new Error(`create study: ${created.status} ${created.text}`);
    study = created.body.study;
  });

  async function stored() {
    const { rows } = await server.database.pool.query('SELECT revision, document FROM studies WHERE id = $1', [study.id]);
    return rows[0] as { revision: number; document: unknown };
  }

  async function save(document: unknown, baseRevision: unknown = study.revision) {
    const before = await stored();
    const res = await sendJson('PUT', `/api/teams/${teamId}/studies/${study.id}`, { baseRevision, document, message: 'generated' });
    // Any document, however broken (an unknown key deep inside included), is refused without a 500.
    expect(res.status, `${res.status} for ${JSON.stringify(document).slice(0, 300)}: ${res.text.slice(0, 300)}`).toBeLessThan(500);
    const after = await stored();
    if (res.status >= 200 && res.status < 300) {
      expect(after.revision).toBe(before.revision + 1);
      study.revision = after.revision;
      // What was stored is a valid document, and the engine computes it without NaN or Infinity.
      const valid = studyDocumentSchema.safeParse(after.document);
      expect(valid.success).toBe(true);
      if (valid.success) expect(nonFinite(runStudyDocument(valid.data, builtinById))).toEqual([]);
    } else {
      expectErrorShape(res.body);
      // Refused: nothing stored, not even part of it.
      expect(after.revision).toBe(before.revision);
      expect(after.document).toEqual(before.document);
    }
  }

  it('valid ones are saved as the next revision, and compute to finite numbers', async () => {
    await fc.assert(
      fc.asyncProperty(validStudyArb, (doc) => save(doc)),
      { numRuns: 12 },
    );
  }, 60_000);

  it('nearly valid ones never answer 500 and a refused one leaves the study as it was', async () => {
    await fc.assert(
      fc.asyncProperty(fc.nat(), mutationArb, (pick, m) => save(mutate(demo, pick, m))),
      { numRuns: 120 },
    );
  }, 90_000);

  it('garbage documents and base revisions never answer 500', async () => {
    await fc.assert(
      fc.asyncProperty(fc.jsonValue({ maxDepth: 3 }), hostileValue, async (doc, baseRevision) => save(doc, baseRevision)),
      { numRuns: 40 },
    );
  }, 60_000);
});

// ——— map files ———

const sampleMapFiles = [
  ...readdirSync(path.join(root, 'data', 'maps'))
    .filter((f) => f.endsWith('.csv'))
    .map((f) => path.join(root, 'data', 'maps', f)),
  ...readdirSync(path.join(root, 'tests', 'fixtures', 'maps', 'good')).map((f) => path.join(root, 'tests', 'fixtures', 'maps', 'good', f)),
].map((file) => readFileSync(file, 'utf8'));

const oddNumber = fc.constantFrom(
  '1e308',
  '-1e308',
  '1e999',
  '-0',
  'NaN',
  'Infinity',
  '0x10',
  '1,5',
  '',
  ' ',
  '5e-324',
  '9007199254740993',
  '1_000',
  '+1',
  '.',
  '-',
);
type LineEdit =
  | { op: 'delete' | 'duplicate'; line: number }
  | { op: 'swap'; line: number; other: number }
  | { op: 'replace'; line: number; text: string }
  | { op: 'insert'; line: number; at: number; text: string }
  | { op: 'number'; line: number; cell: number; text: string };
const lineEditArb: fc.Arbitrary<LineEdit> = fc.oneof(
  fc.record({ op: fc.constantFrom('delete' as const, 'duplicate' as const), line: fc.nat() }),
  fc.record({ op: fc.constant('swap' as const), line: fc.nat(), other: fc.nat() }),
  fc.record({ op: fc.constant('replace' as const), line: fc.nat(), text: fc.string({ unit: 'binary', maxLength: 40 }) }),
  fc.record({
    op: fc.constant('insert' as const),
    line: fc.nat(),
    at: fc.nat(),
    text: fc.oneof(fc.string({ maxLength: 5 }), fc.constantFrom(',', '"', '\u0000', '\r', '=', ';', '#')),
  }),
  fc.record({ op: fc.constant('number' as const), line: fc.nat(), cell: fc.nat(), text: oddNumber }),
);

function editLines(text: string, edits: LineEdit[]): string {
  const lines = text.split('\n');
  for (const e of edits) {
    const i = e.line % lines.length;
    if (e.op === 'delete') lines.splice(i, 1);
    else if (e.op === 'duplicate') lines.splice(i, 0, lines[i]);
    else if (e.op === 'swap') {
      const j = e.other % lines.length;
      [lines[i], lines[j]] = [lines[j], lines[i]];
    } else if (e.op === 'replace') lines[i] = e.text;
    else if (e.op === 'insert') lines[i] = lines[i].slice(0, e.at % (lines[i].length + 1)) + e.text + lines[i].slice(e.at % (lines[i].length + 1));
    else if (e.op === 'number') {
      const cells = lines[i].split(',');
      cells[e.cell % cells.length] = e.text;
      lines[i] = cells.join(',');
    }
    if (lines.length === 0) lines.push('');
  }
  return lines.join('\n');
}

describe('generated map files', () => {
  async function upload(bytes: Uint8Array) {
    const form = new FormData();
    form.append('file', new Blob([Uint8Array.from(bytes)]), 'generated.csv');
    const res = await send('POST', `/api/teams/${teamId}/maps`, form);
    expect(res.status, `${res.status}: ${res.text.slice(0, 300)}`).toBeLessThan(500);
    if (res.status === 201) {
      const parsed = parseMapFile(bytes);
      expect(parsed.ok).toBe(true);
      if (parsed.ok) expect(nonFinite(parsed.map)).toEqual([]);
      expect(nonFinite(res.body.map)).toEqual([]);
      // Served back without trouble, as a whole file too.
      expect((await send('GET', `/api/teams/${teamId}/maps/${res.body.map.id}`)).status).toBe(200);
      expect((await send('GET', `/api/teams/${teamId}/maps/${res.body.map.id}/file`)).status).toBe(200);
    } else {
      expectErrorShape(res.body);
    }
  }

  it('demo and fixture files with lines deleted, doubled, swapped, replaced or with odd numbers never answer 500', async () => {
    await fc.assert(
      fc.asyncProperty(fc.constantFrom(...sampleMapFiles), fc.array(lineEditArb, { minLength: 1, maxLength: 4 }), async (file, edits) =>
        upload(new TextEncoder().encode(editLines(file, edits))),
      ),
      { numRuns: 80 },
    );
  }, 90_000);

  it('random bytes never answer 500', async () => {
    await fc.assert(fc.asyncProperty(fc.uint8Array({ maxLength: 2048 }), upload), { numRuns: 40 });
  }, 60_000);
});

// ——— one attack at a time ———

const nested = (depth: number, open: string, close: string, inner = '1') => open.repeat(depth) + inner + close.repeat(depth);

describe('deeply nested JSON', () => {
  it.each([
    ['arrays, 10 000 levels', nested(10_000, '[', ']')],
    ['objects, 10 000 levels', nested(10_000, '{"a":', '}')],
    ['arrays, 200 000 levels', nested(200_000, '[', ']')],
    ['objects inside a study document, 5 000 levels', `{"baseRevision":1,"document":{"notes":${nested(5_000, '{"a":', '}')}}}`],
  ])('%s is refused with 400, and the server carries on', async (_name, body) => {
    for (const url of ['/api/compute', `/api/teams/${teamId}/studies/no-such-study`, '/api/auth/sign-in']) {
      const res = await send(url === '/api/compute' ? 'POST' : url.includes('studies') ? 'PUT' : 'POST', url, body);
      expect(res.status).toBe(400);
      expect(res.body.error.code).toBe('too_deep');
    }
    expect((await send('GET', '/api/health')).status).toBe(200);
  });

  it('nesting within the limit still parses (64 levels, server/http/body.ts JSON_MAX_DEPTH)', async () => {
    const res = await send('POST', '/api/compute', `{"x":${nested(60, '[', ']')}}`);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_input'); // parsed, then refused by the schema: unknown key x
  });
});

describe('huge and odd numbers', () => {
  const request = (point: Record<string, unknown>, engine: Record<string, unknown> = {}) => ({
    engine: { displacement: 0.002, cylinders: 4, strokes: 4, ...engine },
    ambient: { pressure: 101325, temperature: 293.15 },
    points: [{ rpm: 6000, volumetricEfficiency: 0.95, boost: 100000, manifoldTemperature: 320, ...point }],
  });

  it('1e308, a number past double range, 5e-324 and 2^53 + 1 are refused by field path', async () => {
    const cases: [string, string][] = [
      [JSON.stringify(request({ boost: 1e308 })), 'points.0.boost'],
      [JSON.stringify(request({}, { displacement: 1e308 })), 'engine.displacement'],
      // JSON text past double range parses to Infinity in JavaScript: it must not get through.
      [JSON.stringify(request({})).replace('"boost":100000', '"boost":1e400'), 'points.0.boost'],
      [JSON.stringify(request({}, { cylinders: 2 ** 53 + 1 })), 'engine.cylinders'],
    ];
    for (const [body, field] of cases) {
      const res = await send('POST', '/api/compute', body, 'application/json');
      expect(res.status, body).toBe(400);
      expect(res.body.error.details.issues.map((i: { path: string }) => i.path)).toContain(field);
    }
  });

  it('the smallest number above 0 (5e-324) as rpm is computed to finite numbers or refused, never 500', async () => {
    const input = request({ rpm: 5e-324 });
    const res = await sendJson('POST', '/api/compute', input);
    expect([200, 400]).toContain(res.status);
    if (res.status === 200) {
      expect(nullsIn(res.body)).toEqual([]);
      expect(nonFinite(runComputeRequest(computeRequestSchema.parse(input)))).toEqual([]);
    }
  });

  it('-0 is a number like 0: computed, finite', async () => {
    const res = await sendJson('POST', '/api/compute', request({ boost: -0 }));
    expect(res.status).toBe(200);
    expect(nullsIn(res.body)).toEqual([]);
    expect(res.body.points[0].manifoldPressure).toBeCloseTo(101325, 6); // boost 0 gauge: manifold at ambient (from the request)
  });

  it('numbers as strings are refused, naming the field', async () => {
    const res = await sendJson('POST', '/api/compute', request({ rpm: '6000' }, { displacement: '0.002' }));
    expect(res.status).toBe(400);
    const paths = res.body.error.details.issues.map((i: { path: string }) => i.path);
    expect(paths).toEqual(expect.arrayContaining(['engine.displacement', 'points.0.rpm']));
  });
});

describe('unicode in names', () => {
  const kept = [
    ['emoji', 'Boost 🚀🔥 team 👩🏽‍🔧'],
    ['right-to-left text', 'צוות טורבו فريق'],
    ['a right-to-left override', 'map\u202Eevil.csv'],
    ['combining marks', 'Z\u0351\u0358a\u0300\u0301\u0302l\u0303g\u0304o'],
  ] as const;

  it.each(kept)('%s in a team name and a study title is kept exactly', async (_what, text) => {
    const team = await sendJson('POST', '/api/teams', { name: text });
    expect(team.status).toBe(201);
    expect(team.body.team.name).toBe(text.trim());
    const created = await sendJson('POST', `/api/teams/${team.body.team.id}/studies`, { title: text, document: demo });
    expect(created.status).toBe(201);
    const got = await send('GET', `/api/teams/${team.body.team.id}/studies/${created.body.study.id}`);
    expect(got.body.study.title).toBe(text.trim());
  });

  it.each([
    ['the NUL character', 'Harrow\u0000Hill'],
    ['half of a surrogate pair', 'Harrow \uD83D Hill'],
  ])('%s is refused with 400 naming the field, in names, titles and notes', async (_what, text) => {
    const team = await sendJson('POST', '/api/teams', { name: text });
    expect(team.status).toBe(400);
    expect(team.body.error.details.issues[0].path).toBe('name');
    const study = await sendJson('POST', `/api/teams/${teamId}/studies`, { title: 'fine', document: { ...demo, notes: text } });
    expect(study.status).toBe(400);
    expect(study.body.error.details.issues[0].path).toBe('document.notes');
    const signUp = await sendJson('POST', '/api/auth/sign-up', { email: uniqueEmail('nul'), password: PASSWORD, name: text }, false);
    expect(signUp.status).toBe(400);
  });

  it('NUL in a URL path is an unknown thing (404), not a database error', async () => {
    for (const url of [`/api/teams/%00/studies`, `/api/teams/${teamId}/studies/%00`, `/api/teams/${teamId}/maps/a%00b`, '/api/share/%00']) {
      const res = await send('GET', url);
      expect(res.status, url).toBe(404);
      expectErrorShape(res.body);
    }
  });
});

/** A raw connection, for bodies that fetch will not send the way an attacker does. */
function rawConnection(port: number) {
  const socket = net.connect(port, '127.0.0.1');
  let received = '';
  let sent = 0;
  socket.on('data', (d: Buffer) => (received += d.toString('latin1')));
  socket.on('error', () => undefined); // the server cuts these connections: that is the point
  const closed = new Promise<number>((resolve) => socket.once('close', () => resolve(Date.now())));
  const connected = new Promise<void>((resolve) => socket.once('connect', () => resolve()));
  return {
    socket,
    connected,
    closed,
    received: () => received,
    sent: () => sent,
    write: (data: string | Buffer) =>
      new Promise<boolean>((resolve) => {
        if (socket.destroyed) return resolve(false);
        sent += data.length;
        socket.write(data, (err) => resolve(!err));
      }),
  };
}

const portOf = () => Number(new URL(base).port);
const LIMIT = 1024 * 1024; // server/http/body.ts JSON_BODY_LIMIT_BYTES

describe('a 20 MB body', () => {
  const twentyMb = 20 * 1024 * 1024;

  it('with its Content-Length is refused with 413 before it is read', async () => {
    const c = rawConnection(portOf());
    await c.connected;
    await c.write(`POST /api/compute HTTP/1.1\r\nHost: x\r\nOrigin: ${ORIGIN}\r\nContent-Type: application/json\r\nContent-Length: ${twentyMb}\r\n\r\n`);
    await c.write(Buffer.alloc(64 * 1024, 0x20));
    const t0 = Date.now();
    while (!c.received().includes('\r\n\r\n') && Date.now() - t0 < 5_000) await new Promise((r) => setTimeout(r, 20));
    expect(c.received()).toMatch(/^HTTP\/1\.1 413/);
    expect(c.received().toLowerCase()).toContain('connection: close');
    expect(c.received()).toContain('"too_large"');
    await c.closed; // the server hangs up instead of reading the remaining 19.9 MB
    expect(c.sent()).toBeLessThan(LIMIT);
  });

  it('streamed without a Content-Length is cut off with 413 soon after the limit', async () => {
    const c = rawConnection(portOf());
    await c.connected;
    await c.write(`POST /api/compute HTTP/1.1\r\nHost: x\r\nOrigin: ${ORIGIN}\r\nContent-Type: application/json\r\nTransfer-Encoding: chunked\r\n\r\n`);
    const chunk = Buffer.alloc(64 * 1024, 0x20);
    const framed = Buffer.concat([Buffer.from(`${chunk.length.toString(16)}\r\n`), chunk, Buffer.from('\r\n')]);
    let body = 0;
    while (body < twentyMb && !c.received().includes('\r\n\r\n')) {
      if (!(await c.write(framed))) break;
      body += chunk.length;
    }
    const t0 = Date.now();
    while (!c.received().includes('\r\n\r\n') && Date.now() - t0 < 5_000) await new Promise((r) => setTimeout(r, 20));
    expect(c.received()).toMatch(/^HTTP\/1\.1 413/);
    await c.closed;
    // Refused a little after 1 MB: socket buffers let a few more chunks out before the answer arrives.
    expect(body).toBeLessThan(8 * LIMIT);
  });

  it('a file upload over the map file limit is refused with 413 too', async () => {
    const form = new FormData();
    form.append('file', new Blob([new Uint8Array(3 * 1024 * 1024).fill(0x31)]), 'big.csv');
    const res = await send('POST', `/api/teams/${teamId}/maps`, form);
    expect(res.status).toBe(413);
    expectErrorShape(res.body);
  });
});

describe('slow clients', () => {
  it('headers trickled in are cut off after HEADERS_TIMEOUT_MS with 408', async () => {
    const c = rawConnection(portOf());
    await c.connected;
    const t0 = Date.now();
    await c.write('GET /api/health HTTP/1.1\r\nHost: x\r\n');
    let closedAt = 0;
    void c.closed.then((at) => (closedAt = at));
    for (let i = 0; i < 100 && !closedAt; i++) {
      await c.write(`X-Slow-${i}: ${i}\r\n`);
      await new Promise((r) => setTimeout(r, 100));
    }
    expect(closedAt).toBeGreaterThan(0);
    expect(closedAt - t0).toBeLessThan(HEADERS_TIMEOUT_MS + 3_000); // bound plus Node's check interval and slack (common practice, no source)
    expect(c.received()).toMatch(/^HTTP\/1\.1 408/);
  });

  it('a body trickled in is cut off after REQUEST_TIMEOUT_MS with 408, and the server carries on', async () => {
    const c = rawConnection(portOf());
    await c.connected;
    const t0 = Date.now();
    await c.write(`POST /api/compute HTTP/1.1\r\nHost: x\r\nOrigin: ${ORIGIN}\r\nContent-Type: application/json\r\nContent-Length: 10000\r\n\r\n{"engine":`);
    let closedAt = 0;
    void c.closed.then((at) => (closedAt = at));
    for (let i = 0; i < 200 && !closedAt; i++) {
      await c.write(' ');
      await new Promise((r) => setTimeout(r, 100));
    }
    expect(closedAt).toBeGreaterThan(0);
    expect(closedAt - t0).toBeGreaterThanOrEqual(REQUEST_TIMEOUT_MS - 100); // not before the bound (100 ms timer slack, from memory)
    expect(closedAt - t0).toBeLessThan(REQUEST_TIMEOUT_MS + 3_000);
    expect(c.received()).toMatch(/^HTTP\/1\.1 408/);
    expect((await send('GET', '/api/health')).status).toBe(200);
  });
});

describe('what the routes let through', () => {
  // Runs last: looks at what the server logged while answering everything above.
  it('nothing above made an unhandled error, and only known cases reached the database net', () => {
    const text = (l: LogLine) => JSON.stringify(l.err ?? {});
    expect(logs.filter((l) => l.msg === 'unhandled error').map(text)).toEqual([]);
    // Anything the database net caught is a route letting bad input through: a new case to look at.
    const netted = logs.filter((l) => l.msg === 'input the database refused reached it');
    expect(netted.map((l) => `${l.url}: ${text(l)}`)).toEqual([]);
  });
});
