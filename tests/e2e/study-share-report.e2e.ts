import { randomUUID } from 'node:crypto';
import { mkdirSync, statSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import type { CompressorMap } from '#shared/maps/types';
import { migrateStudyDocument, studyDocumentSchema } from '#shared/schemas/study';
import { planVerdicts, VERDICT_RANK } from '#shared/matching/verdict';
import { compareLines } from '#shared/study/compare';
import { runStudyDocument } from '#shared/study/run';
import { DEFAULT_LESSON, runLesson } from '#src/features/learn/lesson';
import { baseUrl, builtinMap, DEMO_USER, screenshot, shownNumber, signIn, suiteBrowser } from './browser';

// Side by side, the printable report, a share link opened signed out (and revoked), and the Learn
// page, in the production build. The test makes its own study from the demo through the API.

const root = path.resolve(import.meta.dirname, '..', '..');
const DEMO = { ...DEMO_USER, study: 'Hill-climb 2.0: which compressor?' };
// plotly.js is large and this machine may be busy: give plots time to arrive (the report draws ten).
const PLOT_TIMEOUT = 180_000;

function builtinCompressor(id: string): CompressorMap {
  const map = builtinMap(id);
  if (map.kind !== 'compressor') throw new Error(`demo map ${id} is not a compressor map`);
  return map;
}

/** State-changing API calls need the app's own Origin (docs/api.md). */
function origin() {
  return { Origin: baseUrl() };
}

describe('Side by side, report, share link and Learn in the browser', () => {
  const suite = suiteBrowser(PLOT_TIMEOUT);
  const newPage = () => suite.newPage({ width: 1280, height: 900 });

  it('compares two combinations, prints the report, shares it signed out and revokes the link', async () => {
    const base = baseUrl();
    const { page, errors } = await newPage();
    await signIn(page);
    // This test reads numbers in SI; set it rather than trust what another test left.
    expect((await page.request.patch(`${base}/api/auth/me`, { data: { unitSystem: 'si' }, headers: origin() })).status()).toBe(200);

    const me = (await (await page.request.get(`${base}/api/auth/me`)).json()) as { teams: { id: string; name: string }[] };
    const team = me.teams.find((t) => t.name === DEMO.team);
    expect(team, 'the seeded demo team').toBeTruthy();
    const teamId = team!.id;

    // The demo team's study list shows the seeded study.
    await page.goto(`${base}/teams/${teamId}/studies`);
    await page.getByText(DEMO.study).first().waitFor();

    // A fresh study from the demo, owned by this test.
    const title = `Side by side and share ${randomUUID().slice(0, 8)}`;
    const created = await page.request.post(`${base}/api/teams/${teamId}/studies`, { data: { title }, headers: origin() });
    expect(created.status()).toBe(201);
    const study = (await created.json()) as { study: { id: string; document: unknown } };
    const studyId = study.study.id;
    const doc = studyDocumentSchema.parse(migrateStudyDocument(study.study.document));
    expect(doc.plans.length).toBeGreaterThanOrEqual(3); // the demo compares three compressors (data/demo/hillclimb-study.json)

    // ——— Side by side: the default is every plan at the first scenario; untick the third plan.
    await page.goto(`${base}/teams/${teamId}/studies/${studyId}/compare`);
    await page.getByRole('heading', { name: `Side by side: ${title}`, level: 1 }).waitFor();
    const third = `${doc.plans[2].name} · ${doc.scenarios[0].name} · ${doc.scenarios[0].boostSchedule[0].label}`;
    const thirdBox = page.getByRole('checkbox', { name: third });
    expect(await thirdBox.isChecked()).toBe(true);
    // The box follows the address (?lines=…), which changes a moment after the click.
    await thirdBox.click();
    await expect.poll(() => thirdBox.isChecked()).toBe(false);
    await page.waitForURL((url) => (url.searchParams.get('lines') ?? '').split(',').length === 2);
    const table = page.getByTestId('differences-table');
    // Figure, unit and "best is", then one column per chosen combination.
    await expect.poll(() => table.locator('thead th').count()).toBe(3 + 2);

    // The table shows what compareLines gives for the same document and maps (the shared engine, run here in node):
    // each line with its plan's verdict, the columns ranked what fits first (stable).
    const maps = Object.fromEntries(doc.plans.flatMap((p) => (p.compressorMapId ? [[p.compressorMapId, builtinMap(p.compressorMapId)]] : [])));
    const result = runStudyDocument(doc, maps);
    const statusOf = new Map(planVerdicts(result).map((v) => [v.planIndex, v.status]));
    const pick = (planIndex: number) => ({
      ...result.lines.find((l) => l.planIndex === planIndex && l.scenarioIndex === 0 && l.rowIndex === 0)!,
      planVerdict: statusOf.get(planIndex),
    });
    const rows = compareLines([pick(0), pick(1)].sort((a, b) => VERDICT_RANK[a.planVerdict!] - VERDICT_RANK[b.planVerdict!]));
    // Best only where the shared rows give it (none at all when neither plan fits).
    expect(await table.locator('[data-best]').count()).toBe(rows.reduce((n, r) => n + r.bestIndices.length, 0));
    const power = rows.find((r) => r.key === 'peakBrakePower')!;
    const powerRow = table.locator('tr[data-row="peakBrakePower"]');
    expect(await powerRow.locator('th').innerText()).toContain('Peak crank power');
    expect(await powerRow.locator('td').nth(0).innerText()).toBe('kW');
    const powerCells = powerRow.locator('td');
    for (const [i, cell] of power.cells.entries()) {
      expect(await powerCells.nth(2 + i).innerText()).toContain(shownNumber(cell.value! / 1000)); // W → kW, as the SI screen shows it
    }
    for (const i of power.bestIndices) expect(await powerCells.nth(2 + i).getAttribute('data-best')).toBe('true');

    await page.locator('.js-plotly-plot .main-svg').first().waitFor();
    await screenshot(page, 'side-by-side');

    // ——— The printable report: every section, the caution, then a PDF.
    await page.goto(`${base}/teams/${teamId}/studies/${studyId}/report`);
    await page.getByRole('heading', { name: title, level: 1 }).waitFor();
    await page.getByTestId('plan-verdicts').waitFor(); // the verdicts on the first page, before the inputs
    for (const heading of [
      '1. Inputs',
      '2. Assumptions',
      '3. Compressor maps with every operating line',
      '4. Curves against engine speed',
      '5. Findings',
      '6. Results by operating point',
    ]) {
      await page.getByRole('heading', { name: heading, level: 2 }).waitFor();
    }
    await page.getByTestId('study-caution').first().waitFor();
    await page.getByText(/^1, saved /).waitFor(); // revision 1, with its date
    await page.locator('[data-plots-ready="true"]').waitFor();
    await screenshot(page, 'report');

    await page.emulateMedia({ media: 'print' });
    expect(await page.getByRole('button', { name: 'Print' }).isVisible()).toBe(false); // hidden on paper
    expect(await page.getByTestId('study-caution').first().isVisible()).toBe(true);
    const pdfPath = path.join(root, 'test-results', 'report.pdf');
    mkdirSync(path.dirname(pdfPath), { recursive: true });
    const pdf = await page.pdf({ path: pdfPath, format: 'A4', printBackground: true });
    expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    expect(statSync(pdfPath).size).toBeGreaterThan(50_000); // ten plots and the tables, not an empty page
    await page.emulateMedia({ media: 'screen' });

    // ——— A share link, opened in a new context that has never signed in.
    const made = await page.request.post(`${base}/api/teams/${teamId}/studies/${studyId}/share-links`, { data: {}, headers: origin() });
    expect(made.status()).toBe(201);
    const { shareLink } = (await made.json()) as { shareLink: { id: string; url: string } };
    const token = new URL(shareLink.url).pathname.split('/').pop()!;

    const { page: guest, errors: guestErrors } = await newPage();
    expect((await guest.request.get(`${base}/api/auth/me`)).status()).toBe(401); // really signed out
    await guest.goto(`${base}/share/${encodeURIComponent(token)}`);
    await guest.getByRole('heading', { name: title, level: 1 }).waitFor();
    await guest.getByTestId('study-caution').first().waitFor();
    await guest.locator('.js-plotly-plot .main-svg').first().waitFor();
    await guest.getByTestId('working-panel').waitFor();
    expect(await guest.locator('input, textarea, [contenteditable="true"]').count()).toBe(0); // nothing to type into
    expect(await guest.getByRole('button', { name: /^save$|save (study|changes|a copy)|^rename|^delete|^archive/i }).count()).toBe(0);
    await screenshot(guest, 'share-view');

    // The printable version of the shared study.
    await guest.getByRole('link', { name: 'Printable report' }).click();
    await guest.getByRole('heading', { name: '1. Inputs', level: 2 }).waitFor();
    await guest.goBack();
    await guest.getByRole('heading', { name: title, level: 1 }).waitFor();

    // Revoked: the same address now says plainly that the link no longer works.
    const revoked = await page.request.delete(`${base}/api/teams/${teamId}/studies/${studyId}/share-links/${shareLink.id}`, { headers: origin() });
    expect(revoked.status()).toBe(204);
    await guest.reload();
    await guest.getByTestId('share-link-gone').waitFor();
    await guest.getByRole('heading', { name: 'This shared study is not available', level: 1 }).waitFor();
    expect(await guest.getByText(title).count()).toBe(0);
    await screenshot(guest, 'share-revoked');

    expect(errors).toEqual([]);
    expect(guestErrors).toEqual([]);
  }, 600_000);

  it('Learn shows its live example on the demo map and follows the sliders', async () => {
    const base = baseUrl();
    const { page, errors } = await newPage();
    await signIn(page);
    expect((await page.request.patch(`${base}/api/auth/me`, { data: { unitSystem: 'si' }, headers: origin() })).status()).toBe(200);

    await page.goto(`${base}/learn`);
    await page.getByRole('heading', { name: 'Learn: corrected flow and pressure ratio', level: 1 }).waitFor();
    await page.locator('.js-plotly-plot .main-svg').first().waitFor();
    await page.locator('p[aria-live="polite"]', { hasText: 'The point lands inside the map' }).waitFor();

    // The page shows the engine's own numbers for the starting values (same module, run here in node).
    const lesson = runLesson(DEFAULT_LESSON, builtinCompressor('builtin-compressor-m58'));
    const v = lesson.point.values!;
    const facts = page.getByRole('definition');
    const corrected = page.locator('dt', { hasText: /^Corrected mass flow$/ }).locator('xpath=following-sibling::dd[1]');
    expect(await corrected.innerText()).toBe(`${shownNumber(v.correctedMassFlow)} kg/s`);
    const ratio = page.locator('dt', { hasText: /^Pressure ratio$/ }).locator('xpath=following-sibling::dd[1]');
    expect(await ratio.innerText()).toBe(shownNumber(v.pressureRatio, 3));
    expect(await facts.count()).toBeGreaterThan(4);

    // More boost: a higher pressure ratio (the slider moves in 5 kPa steps).
    const before = v.pressureRatio;
    const boost = page.getByRole('slider', { name: 'Boost' });
    await boost.focus();
    for (let i = 0; i < 4; i++) await page.keyboard.press('ArrowRight');
    await expect.poll(async () => Number(await ratio.innerText())).toBeGreaterThan(before);
    const more = runLesson({ ...DEFAULT_LESSON, boost: DEFAULT_LESSON.boost + 20_000 }, builtinCompressor('builtin-compressor-m58'));
    expect(await ratio.innerText()).toBe(shownNumber(more.point.values!.pressureRatio, 3)); // 4 steps of 5 kPa, from the slider's own grid

    // Every section of the walk-through is there, with formulas and sources.
    for (const heading of [
      '1. The air outside',
      '4. Corrected flow: the across-the-page axis of the map',
      '5. Pressure ratio: the up-the-page axis',
      '7. Where the point lands on the map',
    ]) {
      await page.getByRole('heading', { name: heading, level: 3 }).waitFor();
    }
    expect(await page.getByText(/^Source: /).count()).toBeGreaterThan(8);
    await screenshot(page, 'learn');
    expect(errors).toEqual([]);
  }, 300_000);
});
