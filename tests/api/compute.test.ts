import { randomUUID } from 'node:crypto';
import express from 'express';
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import type { AppDeps } from '#server/app-deps';
import { connectDatabase } from '#server/db/client';
import { errorHandler } from '#server/http/errors';
import { computeRouter } from '#server/routes/compute';
import { createLimits, defaultLimitSettings } from '#server/services/limits';
import { computeResponseSchema, MAX_COMPUTE_POINTS } from '#shared/schemas/compute';
import { expectClose } from '../unit/expect-close';

// The limit is counted in PostgreSQL (the test database); each app counts under its own namespace.
const database = connectDatabase(process.env.DATABASE_URL ?? 'postgres://missing', { max: 2 });
afterAll(() => database.pool.end());

function appWith(options: { rateLimitPerMinute?: number } = {}) {
  const logged: unknown[] = [];
  const app = express();
  app.use(express.json({ limit: '1mb' }));
  const limits = createLimits(
    database.pool,
    { ...defaultLimitSettings(10), computePerMinute: options.rateLimitPerMinute ?? 300 },
    `compute-test-${randomUUID()}:`,
  );
  app.use('/api/compute', computeRouter({ limits } as AppDeps));
  app.use(errorHandler({ error: (obj: unknown) => void logged.push(obj) }));
  return { app, logged };
}

const body = {
  engine: { displacement: 0.002, cylinders: 4, strokes: 4 },
  ambient: { pressure: 100_000, temperature: 288.15 },
  points: [
    { rpm: 6000, volumetricEfficiency: 0.9, boost: 100_000, manifoldTemperature: 320, compressorEfficiency: 0.75 },
    { rpm: 3000, volumetricEfficiency: 0.85, boost: 50_000, manifoldTemperature: 310 },
  ],
};

describe('POST /api/compute', () => {
  it('answers one result per point with exactly the contract fields, SI', async () => {
    const { app, logged } = appWith();
    const res = await request(app).post('/api/compute').send(body);
    expect(res.status).toBe(200);
    const parsed = computeResponseSchema.parse(res.body); // strict: no field beyond the contract
    expect(parsed.points).toHaveLength(2);
    expectClose(parsed.points[0].airDensity, 2.1773, 2e-5); // physics note check table, engine airflow row
    expectClose(parsed.points[0].massFlow, 0.19596, 2e-5); // Heywood (1988) §2.10, physics note check table
    expectClose(parsed.points[0].compressorOutletTemperature, 372.3, 2e-5); // isentropic relation, physics note check table (PR 2, η 0.75)
    expect(parsed.points[1].rpm).toBe(3000); // order kept
    expect(logged).toEqual([]);
  });

  it('adds fuel flow and power when a fuel is given', async () => {
    const { app } = appWith();
    const res = await request(app)
      .post('/api/compute')
      .send({ ...body, fuel: { kind: 'ethanol-blend', ethanolPercent: 85, lambda: 0.8, brakeThermalEfficiency: 0.33, drivetrainLoss: 0.12 } });
    expect(res.status).toBe(200);
    const p = res.body.points[0];
    expectClose(p.fuelMassFlow, 0.19596 / (0.8 * 9.8141), 1e-4); // ṁ_air/(λ·AFR_s), E85 AFR_s 9.814 (blend by mass of Heywood App. D values)
    expectClose(p.wheelPower, 0.88 * p.brakePower, 1e-12); // drivetrain loss (definition)
  });

  it('refuses an unknown field by name with a 400', async () => {
    const { app } = appWith();
    const res = await request(app)
      .post('/api/compute')
      .send({ ...body, engine: { ...body.engine, displacment: 0.002 } });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_input');
    expect(res.body.error.details.issues[0]).toEqual({ path: 'engine', message: 'Unrecognized key: "displacment"' }); // zod 4 strict object wording
    expect(res.body.error.message).toMatch(/displacment/);
  });

  const bad: [string, unknown, string][] = [
    ['negative displacement', { ...body, engine: { ...body.engine, displacement: -1 } }, 'engine.displacement'],
    ['efficiency over 1', { ...body, points: [{ ...body.points[0], compressorEfficiency: 1.5 }] }, 'points.0.compressorEfficiency'],
    ['boost that makes manifold pressure non-positive', { ...body, points: [{ ...body.points[0], boost: -120_000 }] }, 'points.0.boost'],
    ['empty points', { ...body, points: [] }, 'points'],
    ['too many points', { ...body, points: Array.from({ length: MAX_COMPUTE_POINTS + 1 }, () => body.points[1]) }, 'points'],
    ['no body at all', undefined, 'engine'],
  ];
  for (const [what, payload, path] of bad) {
    it(`answers 400 naming ${path} for ${what}`, async () => {
      const { app, logged } = appWith();
      const req = request(app).post('/api/compute');
      const res = payload === undefined ? await req : await req.send(payload as object);
      expect(res.status).toBe(400);
      expect(res.body.error.code).toBe('invalid_input');
      expect(res.body.error.details.issues.map((i: { path: string }) => i.path)).toContain(path);
      expect(logged).toEqual([]); // a client error is not logged as a server fault
    });
  }

  it('answers each point with its findings, most severe first', async () => {
    const { app } = appWith();
    // PR about 11 at 35 % efficiency gives an outlet temperature of thousands of kelvin: never a plain 200 without a word.
    const hot = { ...body, points: [{ rpm: 6000, volumetricEfficiency: 0.9, boost: 1_000_000, manifoldTemperature: 320, compressorEfficiency: 0.35 }] };
    const res = await request(app).post('/api/compute').send(hot);
    expect(res.status).toBe(200);
    const [point] = computeResponseSchema.parse(res.body).points;
    expect(point.compressorOutletTemperature).toBeGreaterThan(1000);
    const codes = point.findings.map((f) => f.code);
    expect(codes).toContain('compressor-outlet-temperature-high'); // above the 200 °C accepted by default (from memory)
    for (const f of point.findings) expect(['info', 'warning', 'limit']).toContain(f.severity);
    const ranks = point.findings.map((f) => ({ limit: 0, warning: 1, info: 2 })[f.severity]);
    expect([...ranks].sort((a, b) => a - b)).toEqual(ranks);
    const quiet = computeResponseSchema.parse((await request(app).post('/api/compute').send(body)).body).points[0];
    expect(quiet.findings.filter((f) => f.severity !== 'info')).toEqual([]);
  });

  it('takes brake power from the fuel when lean: λ 1.2 and 2.0 give less than λ 0.8, as 1/λ', async () => {
    const { app } = appWith();
    const at = async (lambda: number) =>
      (
        await request(app)
          .post('/api/compute')
          .send({ ...body, fuel: { kind: 'petrol', lambda, brakeThermalEfficiency: 0.3 } })
      ).body.points[0];
    const rich = await at(0.8);
    // P = η_b·LHV·min(ṁ_fuel, ṁ_air/AFR_s) (Heywood 1988, eq. 2.23 with the fuel that burns): lean, P ∝ ṁ_fuel ∝ 1/λ.
    expectClose((await at(1.2)).brakePower, rich.brakePower / 1.2, 1e-9);
    expectClose((await at(2.0)).brakePower, rich.brakePower / 2.0, 1e-9);
    const lean = await at(1.05);
    expect(lean.findings.find((f: { code: string }) => f.code === 'lean-under-boost-limit')?.severity).toBe('limit'); // λ above 1.0 under 100 kPa of boost
  });

  const slips: [string, Record<string, number>, string, RegExp][] = [
    ['kPa typed where Pa is meant', { pressure: 101.325, temperature: 288.15 }, 'ambient.pressure', /looks like kPa; write 101325/],
    ['bar typed where Pa is meant', { pressure: 1.01325, temperature: 288.15 }, 'ambient.pressure', /looks like bar/],
    ['a pressure no atmosphere has', { pressure: 150_000, temperature: 288.15 }, 'ambient.pressure', /between 20 000 and 120 000 Pa/],
    ['°C typed where K is meant', { pressure: 101_325, temperature: 25 }, 'ambient.temperature', /looks like °C; write 298.15/],
    ['a temperature no weather has', { pressure: 101_325, temperature: 390 }, 'ambient.temperature', /between 200 and 340 K/],
  ];
  for (const [what, ambient, path, message] of slips) {
    it(`refuses ${what}, naming ${path} and the likely slip`, async () => {
      const { app } = appWith();
      const res = await request(app)
        .post('/api/compute')
        .send({ ...body, ambient });
      expect(res.status).toBe(400);
      const issue = res.body.error.details.issues.find((i: { path: string }) => i.path === path);
      expect(issue?.message).toMatch(message); // 20–120 kPa, 200–340 K: what the atmosphere allows (ISO 2533 ISA to 11 km; from memory for weather)
    });
  }

  it('answers 400 for malformed JSON and 413 for a body over 1 MB', async () => {
    const { app } = appWith();
    const malformed = await request(app).post('/api/compute').set('Content-Type', 'application/json').send('{"engine":');
    expect(malformed.status).toBe(400);
    expect(malformed.body.error.code).toBe('malformed_json');
    const huge = await request(app)
      .post('/api/compute')
      .send({ ...body, padding: 'x'.repeat(1_100_000) });
    expect(huge.status).toBe(413);
  });

  it('rate-limits each client, answering 429 with Retry-After', async () => {
    const { app } = appWith({ rateLimitPerMinute: 3 });
    for (let i = 0; i < 3; i++) expect((await request(app).post('/api/compute').send(body)).status).toBe(200);
    const limited = await request(app).post('/api/compute').send(body);
    expect(limited.status).toBe(429);
    expect(limited.body.error.code).toBe('rate_limited');
    expect(limited.body.error.message).toMatch(/^Too many compute requests\. Wait \d+ seconds? and try again\.$/);
    const wait = Number(limited.headers['retry-after']);
    expect(wait).toBeGreaterThan(0);
    expect(wait).toBeLessThanOrEqual(60); // the window is one minute (server/services/limits.ts)
  });
});
