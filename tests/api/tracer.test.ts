import { count, eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parseMapFile } from '#shared/maps';
import { applyAffine } from '#shared/tracer/affine';
import { newTraceState, type TraceState } from '#shared/tracer/state';
import { auditEvents, mapImages, maps, teamMembers, traceDrafts } from '#server/db/schema';
import { GIF_BYTES, jpegHeaderOnly, pngHeaderOnly, pngPicture } from '../unit/tracer/images';
import { expectErrorShape, ORIGIN, signedUp, startTestApp, type Client, type TestApp } from './helpers';

// Limits checked here are the Tracer's own (shared/tracer/image-header.ts: 8 MiB, 40 megapixels),
// common practice, no source. Security checks name OWASP ASVS 5.0 ids: file upload limits and
// content checks (5.2), object-level authorization (8.2, 8.3), CSRF by origin (3.5.1–3.5.3).

let t: TestApp;
let owner: Awaited<ReturnType<typeof signedUp>>;
let teamId: string;
beforeAll(async () => {
  t = await startTestApp();
  owner = await signedUp(t, 'tracer');
  teamId = (await owner.c.post('/api/teams', { name: 'Tracer team' })).body.team.id;
});
afterAll(async () => {
  await t.close();
});

function uploadPicture(c: Client, team: string, fileName: string, bytes: Buffer, contentType = 'image/png') {
  return c.agent.post(`/api/teams/${team}/tracer/images`).set('Origin', ORIGIN).attach('file', bytes, { filename: fileName, contentType });
}

async function imageRows(team: string) {
  const [row] = await t.database.db.select({ n: count() }).from(mapImages).where(eq(mapImages.teamId, team));
  return row.n;
}

async function mapRows(team: string) {
  const [row] = await t.database.db.select({ n: count() }).from(maps).where(eq(maps.teamId, team));
  return row.n;
}

/**
 * A complete trace of a small invented compressor map, as if clicked in a 1000 × 700 picture
 * where 1 kg/s is 3000 px across and one unit of pressure ratio 250 px up (no rotation).
 */
function tracedState(name = 'Traced wheel'): TraceState {
  const toPixel = { a: 3000, b: 0, c: 0, d: -250, e: 80, f: 650 };
  const at = (flow: number, ratio: number) => applyAffine(toPixel, { x: flow, y: ratio });
  const state = newTraceState(name);
  state.compressor.referenceTemperature = { value: 298, unit: 'K' };
  state.compressor.referencePressure = { value: 100, unit: 'kPa' };
  state.calibration.clicks = [
    { id: 'x1', role: 'x-axis', pixel: at(0.05, 1), x: 0.05, y: null },
    { id: 'x2', role: 'x-axis', pixel: at(0.25, 1), x: 0.25, y: null },
    { id: 'y1', role: 'y-axis', pixel: at(0, 1.5), x: null, y: 1.5 },
    { id: 'y2', role: 'y-axis', pixel: at(0, 2.5), x: null, y: 2.5 },
  ];
  const line = (id: string, kind: TraceState['curves'][number]['kind'], pts: [number, number][], extra: { speed?: number; efficiency?: number } = {}) => ({
    id,
    kind,
    speed: extra.speed ?? null,
    efficiency: extra.efficiency ?? null,
    points: pts.map(([f, r]) => at(f, r)),
  });
  state.curves = [
    line('surge', 'surge', [
      [0.05, 1.2],
      [0.08, 1.8],
      [0.1, 2.4],
    ]),
    line('choke', 'choke', [
      [0.14, 1.1],
      [0.2, 1.6],
      [0.24, 2.1],
    ]),
    line(
      's80',
      'speed',
      [
        [0.05, 1.2],
        [0.1, 1.17],
        [0.14, 1.1],
      ],
      { speed: 80000 },
    ),
    line(
      's120',
      'speed',
      [
        [0.08, 1.8],
        [0.14, 1.72],
        [0.2, 1.6],
      ],
      { speed: 120000 },
    ),
    line(
      'i74',
      'island',
      [
        [0.12, 1.7],
        [0.16, 1.72],
        [0.15, 1.6],
      ],
      { efficiency: 74 },
    ),
  ];
  return state;
}

async function newDraft(c: Client, team: string, name = 'A trace') {
  const image = await uploadPicture(c, team, 'scan.png', pngPicture(40, 30));
  expect(image.status).toBe(201);
  const draft = await c.post(`/api/teams/${team}/tracer/drafts`, { imageId: image.body.image.id, name });
  expect(draft.status).toBe(201);
  return { imageId: image.body.image.id as string, draft: draft.body.draft as { id: string; revision: number; state: TraceState } };
}

describe('picture upload: checked by content, limited, never stored when refused (ASVS 5.2)', () => {
  it('stores a PNG and serves it back with the detected type, nosniff and a generated name', async () => {
    const bytes = pngPicture(64, 48);
    // A hostile name and a claimed type that would run as a page: both are ignored.
    const res = await uploadPicture(owner.c, teamId, '<script>alert(1)</script>.html', bytes, 'text/html');
    expect(res.status).toBe(201);
    expect(res.body.image).toMatchObject({ contentType: 'image/png', width: 64, height: 48, byteSize: bytes.length, mapId: null });
    const id = res.body.image.id;
    const served = await owner.c
      .get(`/api/teams/${teamId}/tracer/images/${id}`)
      .buffer(true)
      .parse((r, cb) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => cb(null, Buffer.concat(chunks)));
      });
    expect(served.status).toBe(200);
    expect(served.headers['content-type']).toBe('image/png');
    expect(served.headers['x-content-type-options']).toBe('nosniff');
    expect(served.headers['content-disposition']).toBe(`inline; filename="map-image-${id}.png"`);
    expect(Buffer.compare(served.body as Buffer, bytes)).toBe(0);
  });

  it('a JPEG named .png is stored and served as what it is: a JPEG', async () => {
    const res = await uploadPicture(owner.c, teamId, 'photo.png', jpegHeaderOnly(1200, 900), 'image/png');
    expect(res.status).toBe(201);
    expect(res.body.image).toMatchObject({ contentType: 'image/jpeg', width: 1200, height: 900 });
    const served = await owner.c.get(`/api/teams/${teamId}/tracer/images/${res.body.image.id}`);
    expect(served.headers['content-type']).toBe('image/jpeg');
    expect(served.headers['content-disposition']).toMatch(/filename="map-image-[^"]+\.jpg"/);
  });

  const refused: [string, () => Buffer, string, number, string, RegExp][] = [
    [
      'text renamed to .png',
      () => Buffer.from('curve,label,flow\nsurge,,1,1.2\n'),
      'map.png',
      400,
      'not_an_image',
      /not a PNG or JPEG picture, whatever its name says/,
    ],
    ['a GIF renamed to .png', () => GIF_BYTES, 'map.png', 400, 'not_an_image', /GIF picture, whatever its name says/],
    [
      'an SVG renamed to .png',
      () => Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>'),
      'map.png',
      400,
      'not_an_image',
      /SVG drawing/,
    ],
    ['a zero-byte file', () => Buffer.alloc(0), 'empty.png', 400, 'empty_file', /empty \(0 bytes\)/],
    ['a PNG of 48 megapixels', () => pngHeaderOnly(8000, 6000), 'huge.png', 413, 'too_many_pixels', /8000 × 6000 pixels .* the limit is 40 megapixels/],
    [
      'a PNG with a damaged header',
      () => pngHeaderOnly(10, 10).subarray(0, 14),
      'broken.png',
      400,
      'unreadable_image',
      /header \(IHDR\) is missing or damaged/,
    ],
    ['a file over 8 MB', () => Buffer.concat([pngHeaderOnly(100, 100), Buffer.alloc(8 * 1024 * 1024)]), 'big.png', 413, 'too_large', /larger than 8 MB/],
  ];
  for (const [what, bytes, name, status, code, message] of refused) {
    it(`refuses ${what} with a clear message and stores nothing`, async () => {
      const before = await imageRows(teamId);
      const res = await uploadPicture(owner.c, teamId, name, bytes());
      expect(res.status).toBe(status);
      expectErrorShape(res.body);
      expect(res.body.error.code).toBe(code);
      expect(res.body.error.message).toMatch(message);
      expect(await imageRows(teamId)).toBe(before);
    });
  }

  it('a request without a picture names the field; two pictures or extra fields are refused', async () => {
    const none = await owner.c.agent.post(`/api/teams/${teamId}/tracer/images`).set('Origin', ORIGIN).field('x', 'y');
    expect(none.status).toBe(400);
    const empty = await owner.c.agent.post(`/api/teams/${teamId}/tracer/images`).set('Origin', ORIGIN).type('form').send('');
    expect(empty.status).toBe(400);
    expect(empty.body.error.details.issues[0].path).toBe('file');
    const two = await owner.c.agent
      .post(`/api/teams/${teamId}/tracer/images`)
      .set('Origin', ORIGIN)
      .attach('file', pngPicture(4, 4), 'a.png')
      .attach('file', pngPicture(4, 4), 'b.png');
    expect(two.status).toBe(400);
    expectErrorShape(two.body);
  });

  it('an upload from another origin, or with no origin on a signed-in session, is refused (ASVS 3.5)', async () => {
    const before = await imageRows(teamId);
    const foreign = await owner.c.agent
      .post(`/api/teams/${teamId}/tracer/images`)
      .set('Origin', 'https://evil.example')
      .attach('file', pngPicture(4, 4), 'a.png');
    expect(foreign.status).toBe(403);
    const bare = await owner.c.agent.post(`/api/teams/${teamId}/tracer/images`).attach('file', pngPicture(4, 4), 'a.png');
    expect(bare.status).toBe(403);
    expect(await imageRows(teamId)).toBe(before);
  });
});

describe('drafts: a trace in progress is kept on the server', () => {
  it('creates, lists, saves with a revision, detects a stale save, deletes with its picture', async () => {
    const { imageId, draft } = await newDraft(owner.c, teamId, 'Scan of a wheel');
    expect(draft.revision).toBe(1);
    expect(draft.state.calibration.clicks).toHaveLength(5); // two on each axis and the corner (newTraceState)
    const list = await owner.c.get(`/api/teams/${teamId}/tracer/drafts`);
    expect(list.body.drafts.find((d: { id: string }) => d.id === draft.id)).toMatchObject({ name: 'Scan of a wheel', kind: 'compressor', curveCount: 0 });

    const state = tracedState('Wheel from the scan');
    const saved = await owner.c.put(`/api/teams/${teamId}/tracer/drafts/${draft.id}`, { baseRevision: 1, state });
    expect(saved.status).toBe(200);
    expect(saved.body.draft).toMatchObject({ revision: 2, name: 'Wheel from the scan', curveCount: 5, pointCount: 15 });
    expect(saved.body.draft.state).toEqual(state);

    // A second tab still on revision 1 is told, and given the newer draft.
    const late = await owner.c.put(`/api/teams/${teamId}/tracer/drafts/${draft.id}`, { baseRevision: 1, state: newTraceState('older') });
    expect(late.status).toBe(409);
    expect(late.body.error.code).toBe('stale_revision');
    expect(late.body.error.details.current.revision).toBe(2);

    expect((await owner.c.delete(`/api/teams/${teamId}/tracer/drafts/${draft.id}`)).status).toBe(204);
    expect((await owner.c.get(`/api/teams/${teamId}/tracer/drafts/${draft.id}`)).status).toBe(404);
    // Nothing else kept the picture, so it went with the draft.
    expect((await owner.c.get(`/api/teams/${teamId}/tracer/images/${imageId}`)).status).toBe(404);
  });

  it('refuses a state that is not a trace, naming the field', async () => {
    const { draft } = await newDraft(owner.c, teamId);
    const state = tracedState();
    const bad = { ...state, curves: [{ ...state.curves[0], points: [{ x: 'left', y: 3 }] }] };
    const res = await owner.c.put(`/api/teams/${teamId}/tracer/drafts/${draft.id}`, { baseRevision: 1, state: bad });
    expect(res.status).toBe(400);
    expect(res.body.error.details.issues[0].path).toBe('state.curves.0.points.0.x');
    const extra = await owner.c.put(`/api/teams/${teamId}/tracer/drafts/${draft.id}`, { baseRevision: 1, state: { ...state, owner: 'x' } });
    expect(extra.status).toBe(400);
    expect(JSON.stringify(extra.body.error.details)).toContain('owner');
  });

  it('a draft needs a picture of the same team', async () => {
    const other = await signedUp(t, 'tracerother');
    const { imageId } = await newDraft(other.c, other.personalTeamId);
    const res = await owner.c.post(`/api/teams/${teamId}/tracer/drafts`, { imageId });
    expect(res.status).toBe(404);
  });
});

describe('save to library: the same check as an upload', () => {
  it('saves a valid trace as a map, keeps the picture with it, and records it', async () => {
    const { imageId, draft } = await newDraft(owner.c, teamId);
    const before = await mapRows(teamId);
    const res = await owner.c.post(`/api/teams/${teamId}/tracer/drafts/${draft.id}/save`, { baseRevision: 1, state: tracedState('Traced M1') });
    expect(res.status).toBe(201);
    expect(res.body.map).toMatchObject({ name: 'Traced M1', kind: 'compressor' });
    expect(res.body.draft.revision).toBe(2);
    expect(await mapRows(teamId)).toBe(before + 1);

    // The map is in the library, its file reads back, and the picture is linked to it.
    const map = await owner.c.get(`/api/teams/${teamId}/maps/${res.body.map.id}`);
    expect(map.status).toBe(200);
    const surge = map.body.map.map.curves.find((c: { kind: string }) => c.kind === 'surge');
    // The trace clicked 0.08 kg/s at PR 1.8 exactly (no rotation, integer-friendly scale).
    expect(surge.points[1]).toMatchObject({ correctedMassFlow: 0.08, pressureRatio: 1.8 });
    const file = await owner.c.get(`/api/teams/${teamId}/maps/${res.body.map.id}/file`);
    expect(parseMapFile(file.text).ok).toBe(true);
    const images = await owner.c.get(`/api/teams/${teamId}/tracer/images?mapId=${res.body.map.id}`);
    expect(images.body.images).toEqual([expect.objectContaining({ id: imageId, mapId: res.body.map.id, mapName: 'Traced M1' })]);
    const [event] = await t.database.db.select().from(auditEvents).where(eq(auditEvents.targetId, res.body.map.id));
    expect(event).toMatchObject({ action: 'map.uploaded', teamId });
    expect(event.details).toMatchObject({ source: 'tracer' });

    // Saved again (say, after a fix): a second map, with its own copy of the picture.
    const again = await owner.c.post(`/api/teams/${teamId}/tracer/drafts/${draft.id}/save`, { baseRevision: 2, state: tracedState('Traced M1, fixed') });
    expect(again.status).toBe(201);
    expect(again.body.draft.image.mapId).toBe(again.body.map.id);
    expect((await owner.c.get(`/api/teams/${teamId}/tracer/images?mapId=${res.body.map.id}`)).body.images).toHaveLength(1);
    // Deleting the draft now keeps both pictures: each belongs to a map.
    const pictures = await imageRows(teamId);
    expect((await owner.c.delete(`/api/teams/${teamId}/tracer/drafts/${draft.id}`)).status).toBe(204);
    expect(await imageRows(teamId)).toBe(pictures);
  });

  it('refuses an incomplete trace with every problem of the file, and saves nothing', async () => {
    const { imageId, draft } = await newDraft(owner.c, teamId);
    const state = tracedState('No choke');
    state.curves = state.curves.filter((c) => c.kind !== 'choke');
    const before = await mapRows(teamId);
    const res = await owner.c.post(`/api/teams/${teamId}/tracer/drafts/${draft.id}/save`, { baseRevision: 1, state });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_map_file');
    expect(res.body.error.details.problems.map((p: { code: string }) => p.code)).toContain('missing-curve');
    expect(await mapRows(teamId)).toBe(before);
    const [image] = await t.database.db.select({ mapId: mapImages.mapId }).from(mapImages).where(eq(mapImages.id, imageId));
    expect(image.mapId).toBeNull();
    const [row] = await t.database.db.select({ revision: traceDrafts.revision }).from(traceDrafts).where(eq(traceDrafts.id, draft.id));
    expect(row.revision).toBe(1); // the refused save changed nothing
  });

  it('refuses a stale save', async () => {
    const { draft } = await newDraft(owner.c, teamId);
    await owner.c.put(`/api/teams/${teamId}/tracer/drafts/${draft.id}`, { baseRevision: 1, state: tracedState() });
    const before = await mapRows(teamId);
    const res = await owner.c.post(`/api/teams/${teamId}/tracer/drafts/${draft.id}/save`, { baseRevision: 1, state: tracedState() });
    expect(res.status).toBe(409);
    expect(await mapRows(teamId)).toBe(before);
  });
});

describe('access: viewers read, editors and owners write, other teams get 404 (ASVS 8.2, 8.3)', () => {
  it('holds for every endpoint', async () => {
    const { imageId, draft } = await newDraft(owner.c, teamId, 'Shared trace');
    const viewer = await signedUp(t, 'tracerviewer');
    await t.database.db.insert(teamMembers).values({ teamId, userId: viewer.user.id, role: 'viewer' });
    const editor = await signedUp(t, 'tracereditor');
    await t.database.db.insert(teamMembers).values({ teamId, userId: editor.user.id, role: 'editor' });
    const outsider = await signedUp(t, 'traceroutsider');
    const base = `/api/teams/${teamId}/tracer`;

    // Viewers read.
    expect((await viewer.c.get(`${base}/drafts`)).status).toBe(200);
    expect((await viewer.c.get(`${base}/drafts/${draft.id}`)).status).toBe(200);
    expect((await viewer.c.get(`${base}/images/${imageId}`)).status).toBe(200);
    expect((await viewer.c.get(`${base}/images/${imageId}/meta`)).status).toBe(200);
    // …and write nothing.
    expect((await uploadPicture(viewer.c, teamId, 'v.png', pngPicture(4, 4))).status).toBe(403);
    expect((await viewer.c.post(`${base}/drafts`, { imageId })).status).toBe(403);
    expect((await viewer.c.put(`${base}/drafts/${draft.id}`, { baseRevision: 1, state: tracedState() })).status).toBe(403);
    expect((await viewer.c.post(`${base}/drafts/${draft.id}/save`, { baseRevision: 1, state: tracedState() })).status).toBe(403);
    expect((await viewer.c.delete(`${base}/drafts/${draft.id}`)).status).toBe(403);

    // Editors write.
    const edited = await editor.c.put(`${base}/drafts/${draft.id}`, { baseRevision: 1, state: tracedState('Edited') });
    expect(edited.status).toBe(200);

    // Outsiders see nothing, by the team's id or by their own team's id with our object ids.
    for (const path of [`${base}/drafts`, `${base}/drafts/${draft.id}`, `${base}/images/${imageId}`, `${base}/images`]) {
      expect((await outsider.c.get(path)).status).toBe(404);
    }
    const own = `/api/teams/${outsider.personalTeamId}/tracer`;
    expect((await outsider.c.get(`${own}/drafts/${draft.id}`)).status).toBe(404);
    expect((await outsider.c.get(`${own}/images/${imageId}`)).status).toBe(404);
    expect((await outsider.c.put(`${own}/drafts/${draft.id}`, { baseRevision: 2, state: tracedState() })).status).toBe(404);
    expect((await outsider.c.delete(`${own}/drafts/${draft.id}`)).status).toBe(404);
    expect((await outsider.c.post(`${own}/drafts/${draft.id}/save`, { baseRevision: 2, state: tracedState() })).status).toBe(404);
    expect((await uploadPicture(outsider.c, teamId, 'o.png', pngPicture(4, 4))).status).toBe(404);
    // Signed out: 401.
    expect((await request(t.app).get(`${base}/drafts`)).status).toBe(401);
    expect((await request(t.app).get(`${base}/images/${imageId}`)).status).toBe(401);
  });
});

describe('pictures cannot be framed', () => {
  it("a Tracer picture is served with frame-ancestors 'none'", async () => {
    const owner = await signedUp(t, 'picture');
    const png = pngPicture(40, 30);
    const up = await owner.c.agent.post(`/api/teams/${owner.personalTeamId}/tracer/images`).set('Origin', ORIGIN).attach('file', png, 'tiny.png');
    expect(up.status).toBe(201);
    const res = await owner.c.get(`/api/teams/${owner.personalTeamId}/tracer/images/${up.body.image.id}`);
    expect(res.headers['content-security-policy']).toContain("frame-ancestors 'none'");
  });
});
