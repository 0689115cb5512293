import Papa from 'papaparse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { teamMembers } from '#server/db/schema';
import { DEMO_VEHICLES } from '#server/services/demo-drive';
import { DEMO_STUDY_FILES } from '#server/services/study-documents';
import { DEMO_USER } from '#server/services/demo';
import { client, expectErrorShape, signedUp, startTestApp, teamWithStudy, type TestApp } from './helpers';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

const vehicle = DEMO_VEHICLES[DEMO_STUDY_FILES.compressor];

/** A team's study made from the demo document, given the demo car as a second revision. */
async function studyWithCar() {
  const made = await teamWithStudy(t);
  const saved = await made.owner.c.put(`/api/teams/${made.teamId}/studies/${made.study.id}`, {
    baseRevision: 1,
    document: { ...made.study.document, vehicle },
    message: 'The car',
  });
  expect(saved.status).toBe(200);
  return made;
}

const rowsOf = (text: string) => Papa.parse<string[]>(text.trim(), { skipEmptyLines: true }).data;

describe('drive.csv and spool.csv', () => {
  it('answers one drive row per plan, gear and road speed, with exactly the contract columns', async () => {
    const { owner, teamId, study } = await studyWithCar();
    const res = await owner.c.get(`/api/teams/${teamId}/studies/${study.id}/drive.csv`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/text\/csv/);
    expect(res.headers['content-disposition']).toBe('attachment; filename="study-drive-r2.csv"');
    const [head, ...rows] = rowsOf(res.text);
    // Contract of the issue: exactly these names, in this order.
    expect(head).toEqual(['Plan', 'Gear', 'Road speed (m/s)', 'Engine speed (rpm)', 'Wheel force (N)', 'Traction limit (N)', 'Usable boost (Pa gauge)']);
    // 3 plans × 4 gears × 23 engine speeds (2500 to 8000 by 250) in the demo study with the demo car.
    expect(rows).toHaveLength(3 * 4 * 23);
    for (const row of rows) {
      expect(Number(row[2])).toBeGreaterThan(0);
      expect(Number(row[5])).toBeGreaterThan(0);
      // A point the compressor cannot give has neither force nor usable boost, never a 0.
      if (row[4] === '') expect(row[6]).toBe('');
    }
    expect(rows.some((r) => r[4] === '')).toBe(true);
  });

  it('answers boost and shaft speed against time for plans with an exhaust side, none for the rest', async () => {
    const { owner, teamId, study } = await studyWithCar();
    const res = await owner.c.get(`/api/teams/${teamId}/studies/${study.id}/spool.csv`);
    expect(res.status).toBe(200);
    const [head, ...rows] = rowsOf(res.text);
    expect(head).toEqual(['Plan', 'Time (s)', 'Boost (Pa gauge)', 'Shaft speed (rpm)']);
    expect(rows).toHaveLength(0); // the demo compressor study's plans have no turbine
  });

  it('lets a viewer download, and refuses outsiders as it does every study of the team', async () => {
    const { teamId, study } = await studyWithCar();
    const viewer = await signedUp(t, 'drive-viewer');
    await t.database.db.insert(teamMembers).values({ teamId, userId: viewer.user.id, role: 'viewer' });
    expect((await viewer.c.get(`/api/teams/${teamId}/studies/${study.id}/drive.csv`)).status).toBe(200);
    const stranger = await signedUp(t, 'drive-stranger');
    expect((await stranger.c.get(`/api/teams/${teamId}/studies/${study.id}/spool.csv`)).status).toBe(404);
  });

  it('says plainly that a study without a vehicle has no drive figures', async () => {
    const { owner, teamId, study } = await teamWithStudy(t);
    for (const file of ['drive.csv', 'spool.csv']) {
      const res = await owner.c.get(`/api/teams/${teamId}/studies/${study.id}/${file}`);
      expect(res.status).toBe(409);
      expectErrorShape(res.body);
      expect(res.body.error.code).toBe('no_vehicle');
      expect(res.body.error.message).toMatch(/no vehicle/);
    }
  });

  it('refuses a bad vehicle by its path, saving nothing', async () => {
    const { owner, teamId, study } = await teamWithStudy(t);
    const res = await owner.c.put(`/api/teams/${teamId}/studies/${study.id}`, {
      baseRevision: 1,
      document: { ...study.document, vehicle: { ...vehicle, tyreRadius: 31 } },
    });
    expect(res.status).toBe(400);
    expect(res.body.error.details.issues[0].path).toBe('document.vehicle.tyreRadius');
    expect((await owner.c.get(`/api/teams/${teamId}/studies/${study.id}`)).body.study.revision).toBe(1);
  });
});

describe('the demo studies', () => {
  it('have their invented cars, one front-drive and one rear-drive, and answer drive and spool rows', async () => {
    const demo = client(t);
    const signIn = await demo.post('/api/auth/sign-in', { email: DEMO_USER.email, password: DEMO_USER.password });
    expect(signIn.status).toBe(200);
    const teamId = (signIn.body.teams as { id: string; personal: boolean }[]).find((x) => !x.personal)!.id;
    const list = (await demo.get(`/api/teams/${teamId}/studies`)).body.studies as { id: string; title: string }[];
    const axles: string[] = [];
    for (const s of list.filter((x) => x.title.startsWith('Hill-climb 2.0'))) {
      const doc = (await demo.get(`/api/teams/${teamId}/studies/${s.id}`)).body.study.document;
      axles.push(doc.vehicle.drivenAxle);
      const drive = rowsOf((await demo.get(`/api/teams/${teamId}/studies/${s.id}/drive.csv`)).text);
      expect(drive.length - 1).toBe(doc.plans.length * 4 * 23); // 4 gears, 23 engine speeds
      const spool = rowsOf((await demo.get(`/api/teams/${teamId}/studies/${s.id}/spool.csv`)).text).slice(1);
      if (doc.plans.some((p: { exhaust?: unknown }) => p.exhaust)) {
        // Both housings spool up from the start: boost rises with time (the shaft balance has a surplus until the target).
        for (const plan of doc.plans) {
          const own = spool.filter((r) => r[0] === plan.name).map((r) => Number(r[2]));
          expect(own.length).toBeGreaterThan(2);
          expect(own[own.length - 1]).toBeGreaterThan(own[0]);
        }
      }
    }
    expect(axles.sort()).toEqual(['front', 'rear']);
  });
});
