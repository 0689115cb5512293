import { describe, expect, it } from 'vitest';
import { rankCompressors, type CandidateMap } from '#shared/candidates';
import { migrateStudyDocument, studyDocumentSchema } from '#shared/schemas/study';
import { DEMO_STUDY_TITLE } from '#server/services/demo';
import { baseUrl, screenshot, suiteBrowser } from './browser';

// Candidates in the production build: a copy of the seeded demo study (the seeded one stays as other
// suites read it), every compressor of the library ranked in a Web Worker, the fitting ones first,
// and one of them added as a plan in one click (a new revision).

const TIMEOUT = 180_000;

describe('Candidates in the browser', () => {
  const suite = suiteBrowser(TIMEOUT);

  it('ranks the library against the demo study, fitting compressors first, and adds one as a plan', async () => {
    const base = baseUrl();
    const origin = { Origin: base };
    const { page, errors, teamId } = await suite.demoPage({ width: 1440, height: 900 });
    const list = (await (await page.request.get(`${base}/api/teams/${teamId}/studies?q=${encodeURIComponent(DEMO_STUDY_TITLE)}`)).json()) as {
      studies: { id: string; title: string }[];
    };
    const demoId = list.studies.find((s) => s.title === DEMO_STUDY_TITLE)!.id;
    const copy = await page.request.post(`${base}/api/teams/${teamId}/studies/${demoId}/duplicate`, { data: { title: 'Candidates check' }, headers: origin });
    expect(copy.status()).toBe(201);
    const { study } = (await copy.json()) as { study: { id: string; revision: number; document: unknown } };

    // What the page must show: the shared ranking on the same document and library, here in node.
    const doc = studyDocumentSchema.parse(migrateStudyDocument(study.document));
    const { maps } = (await (await page.request.get(`${base}/api/teams/${teamId}/candidate-maps?kind=compressor`)).json()) as { maps: CandidateMap[] };
    const expected = rankCompressors(doc, doc.plans[0], maps, 'smallest');
    const fitting = expected.filter((c) => c.verdict.status === 'fits' || c.verdict.status === 'fits-with-warnings');
    expect(fitting.length, 'the demo library has a compressor that fits the demo study (issue 17)').toBeGreaterThan(0);

    // From the study page's tools to Candidates.
    await page.goto(`${base}/teams/${teamId}/studies/${study.id}`);
    await page.getByRole('link', { name: 'Candidates' }).click();
    await page.waitForURL(`**/studies/${study.id}/candidates`);
    const table = page.getByRole('table', { name: 'Compressor candidates' });
    await table.waitFor();
    const rows = table.locator('tbody tr');
    await expect.poll(() => rows.count()).toBe(expected.length);
    // The same order as the shared code gives: fitting maps first, smallest first.
    const names = await rows.evaluateAll((trs) => trs.map((tr) => tr.getAttribute('data-candidate')));
    expect(names).toEqual(expected.map((c) => c.mapName));
    const first = rows.first();
    expect(await first.locator('[data-verdict]').getAttribute('data-verdict')).toBe(fitting[0].verdict.status);
    expect(await first.innerText()).toContain('Surge ');
    await first.locator('svg[role="img"]').waitFor();
    await screenshot(page, 'candidates-ranked');

    // Only maps that fit.
    await page.getByLabel('Only maps that fit').check();
    await expect.poll(() => rows.count()).toBe(fitting.length);

    // One click: the smallest that fits becomes a plan, saved as the next revision.
    await first.getByRole('button', { name: 'Add as a plan' }).click();
    await page.getByText(`${fitting[0].mapName} is now a plan of the study`).waitFor();
    const saved = (await (await page.request.get(`${base}/api/teams/${teamId}/studies/${study.id}`)).json()) as {
      study: { revision: number; document: { plans: { name: string; compressorMapId: string | null }[] } };
    };
    expect(saved.study.revision).toBe(study.revision + 1);
    expect(saved.study.document.plans.at(-1)).toMatchObject({ name: fitting[0].mapName, compressorMapId: fitting[0].mapId });
    await screenshot(page, 'candidates-added');

    // The study page judges the new plan as Candidates did.
    await page.getByRole('link', { name: 'Open the study' }).click();
    const verdict = page.getByTestId(`verdict-plan-${saved.study.document.plans.length - 1}`);
    await verdict.waitFor();
    expect(await verdict.getAttribute('data-verdict')).toBe(fitting[0].verdict.status);
    expect(errors).toEqual([]);
  });

  it('makes a family member of a compressor map on its page, saved as an estimate', async () => {
    const base = baseUrl();
    const { page, errors } = await suite.demoPage({ width: 1280, height: 900 });
    // A team of its own, so the demo team's library stays as the other suites read it.
    const team = await page.request.post(`${base}/api/teams`, { data: { name: 'Family check' }, headers: { Origin: base } });
    expect(team.status()).toBe(201);
    const teamId = ((await team.json()) as { team: { id: string } }).team.id;
    await page.goto(`${base}/teams/${teamId}/maps/builtin-compressor-f60`);
    const panel = page.getByTestId('family-panel');
    await panel.waitFor();
    await panel.getByLabel('Diameter ratio (new ÷ this)').fill('1.2');
    await panel.getByLabel('Name of the new map').fill('F60 at 72 mm (estimate)');
    await panel.getByRole('button', { name: 'Make the map' }).click();
    await panel.getByText('F60 at 72 mm (estimate) is in the library, marked as an estimate').waitFor();
    await screenshot(page, 'candidates-family');
    const { maps } = (await (await page.request.get(`${base}/api/teams/${teamId}/candidate-maps?kind=compressor`)).json()) as { maps: CandidateMap[] };
    const made = maps.find((m) => m.name === 'F60 at 72 mm (estimate)');
    expect(made?.origin).toBe('estimate');
    // A ratio outside the rule's range is refused with the range, and nothing is made.
    await panel.getByLabel('Diameter ratio (new ÷ this)').fill('3');
    await panel.getByRole('button', { name: 'Make the map' }).click();
    await panel.getByText(/diameterRatio must be between 0.5 and 2/).waitFor();
    expect(errors).toEqual([]);
  });
});
