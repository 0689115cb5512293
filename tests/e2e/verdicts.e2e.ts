import { describe, expect, it } from 'vitest';
import { planVerdicts, reasonText, VERDICT_RANK } from '#shared/matching/verdict';
import { migrateStudyDocument, studyDocumentSchema } from '#shared/schemas/study';
import { studyDriveWithMaps } from '#shared/drive/study-drive';
import { compareLines } from '#shared/study/compare';
import { runStudyDocument } from '#shared/study/run';
import { DEMO_STUDY_TITLE } from '#server/services/demo';
import { baseUrl, builtinMap, screenshot, shownNumber, suiteBrowser } from './browser';

// The verdict of each plan in the production build: the seeded demo study (only read here), its
// S44 plan judged "does not fit" with the reason the shared engine gives for the same document and
// maps in node, that reason selecting its point, then Side by side with S44 and another plan: the
// verdict row first and no best anywhere in the S44 column.

const DEMO_STUDY = DEMO_STUDY_TITLE;
// plotly.js is large and this machine may be busy: give plots time to arrive.
const PLOT_TIMEOUT = 180_000;

describe('verdicts in the browser', () => {
  const suite = suiteBrowser(PLOT_TIMEOUT);

  it('judges the S44 plan "does not fit" with its reason, and marks no best on it side by side', async () => {
    const base = baseUrl();
    const { page, errors, teamId } = await suite.demoPage({ width: 1440, height: 900 });
    const list = (await (await page.request.get(`${base}/api/teams/${teamId}/studies?q=${encodeURIComponent(DEMO_STUDY)}`)).json()) as {
      studies: { id: string; title: string }[];
    };
    const studyId = list.studies.find((s) => s.title === DEMO_STUDY)?.id;
    expect(studyId, 'the seeded demo study').toBeTruthy();
    const { study } = (await (await page.request.get(`${base}/api/teams/${teamId}/studies/${studyId}`)).json()) as { study: { document: unknown } };

    // What the page must show: the shared engine on the same document and built-in maps, here in node.
    const doc = studyDocumentSchema.parse(migrateStudyDocument(study.document));
    const maps = Object.fromEntries(doc.plans.flatMap((p) => (p.compressorMapId ? [[p.compressorMapId, builtinMap(p.compressorMapId)]] : [])));
    const result = runStudyDocument(doc, maps);
    const verdicts = planVerdicts(result);
    const s44 = verdicts.find((v) => v.planName.startsWith('S44'))!;
    expect(s44, 'the demo has an S44 plan (data/demo/hillclimb-study.json)').toBeTruthy();
    expect(s44.status).toBe('does-not-fit'); // the S44 wheel chokes at high rpm (the engine, run above)
    const reason = reasonText(s44.reasons[0]);

    // ——— The study page: one verdict per plan above the plots.
    await page.goto(`${base}/teams/${teamId}/studies/${studyId}`);
    const banner = page.getByTestId('plan-verdicts');
    await banner.waitFor();
    const row = page.getByTestId(`verdict-plan-${s44.planIndex}`);
    expect(await row.getAttribute('data-verdict')).toBe('does-not-fit');
    expect(await row.innerText()).toContain('DOES NOT FIT'); // the stamp, set in capitals
    expect(await row.getByTestId('verdict-reason').innerText()).toBe(reason);
    expect(await row.innerText()).toContain(`${shownNumber(s44.pointsAtLimit, 21)} of`);
    for (const v of verdicts) expect(await page.getByTestId(`verdict-plan-${v.planIndex}`).getAttribute('data-verdict')).toBe(v.status);
    // Above the plots: the banner comes before the compressor map on the page.
    const above = await page.evaluate(() => {
      const verdict = document.querySelector('[data-testid="plan-verdicts"]')!;
      const map = document.querySelector('[data-testid="study-map"]')!;
      return Boolean(verdict.compareDocumentPosition(map) & Node.DOCUMENT_POSITION_FOLLOWING);
    });
    expect(above).toBe(true);

    // The reason selects its first point: the Working opens at its engine speed.
    await row.getByRole('button', { name: reason }).click();
    const working = page.getByTestId('working-panel');
    await working.getByRole('heading', { name: `Working at ${shownNumber(s44.reasons[0].fromRpm, 21)} rpm` }).waitFor();
    expect(await working.innerText()).toContain(s44.reasons[0].scenarioName);
    await page.locator('[data-testid="study-map"] .js-plotly-plot .main-svg').first().waitFor();
    await banner.scrollIntoViewIfNeeded();
    await screenshot(page, 'verdicts-study');

    // ——— Side by side: S44 and M58 at the first scenario's first boost row.
    const m58 = doc.plans.find((p) => p.name.startsWith('M58'))!;
    const s44Plan = doc.plans[s44.planIndex];
    const keys = [s44Plan, m58].map((p) => `${p.id}|0|0`);
    await page.goto(`${base}/teams/${teamId}/studies/${studyId}/compare?lines=${encodeURIComponent(keys.join(','))}`);
    const table = page.getByTestId('differences-table');
    await table.waitFor();
    await expect.poll(() => table.locator('thead th').count()).toBe(3 + 2);

    // The same rows in node: columns ranked what fits first (stable), each line with its plan's verdict.
    const statusOf = new Map(verdicts.map((v) => [v.planIndex, v.status]));
    const chosen = [s44.planIndex, doc.plans.indexOf(m58)]
      .map((planIndex, i) => ({ i, planIndex, line: result.lines.find((l) => l.planIndex === planIndex && l.scenarioIndex === 0 && l.rowIndex === 0)! }))
      .sort((a, b) => VERDICT_RANK[statusOf.get(a.planIndex)!] - VERDICT_RANK[statusOf.get(b.planIndex)!] || a.i - b.i);
    // The demo study has its car: Side by side adds each plan's drive figures, as here.
    const drive = studyDriveWithMaps(doc, result, maps);
    const rows = compareLines(chosen.map((c) => ({ ...c.line, planVerdict: statusOf.get(c.planIndex), drive: drive?.byPlan[c.planIndex] ?? null })));
    const s44Column = chosen.findIndex((c) => c.planIndex === s44.planIndex);
    expect(
      await table
        .locator('thead th')
        .nth(3 + s44Column)
        .innerText(),
    ).toContain(s44.planName);

    // The verdict row first, with each plan's verdict.
    const first = table.locator('tbody tr').first();
    expect(await first.getAttribute('data-row')).toBe('planVerdict');
    for (const [i, c] of chosen.entries()) expect(await first.locator('td[data-verdict]').nth(i).getAttribute('data-verdict')).toBe(statusOf.get(c.planIndex));
    // No best on any S44 cell, and exactly the best cells the shared rows give.
    for (const r of rows) expect(r.bestIndices).not.toContain(s44Column);
    expect(await table.locator('td[data-best]').count()).toBe(rows.reduce((n, r) => n + r.bestIndices.length, 0));
    const s44Cells = table.locator(`tbody tr td:nth-child(${4 + s44Column})`);
    expect(await s44Cells.count()).toBe(rows.length);
    for (let i = 0; i < rows.length; i++) expect(await s44Cells.nth(i).getAttribute('data-best')).toBeNull();
    // Its values still show, plainly: the smallest choke margin, negative past choke.
    const choke = rows.find((r) => r.key === 'minChokeMargin')!.cells[s44Column];
    expect(
      await table
        .locator('tr[data-row="minChokeMargin"] td')
        .nth(2 + s44Column)
        .innerText(),
    ).toContain(shownNumber(choke.value! * 100)); // fraction → %

    // The chosen lines' verdicts sit above the map, the S44 one with its reason.
    const card = page.getByTestId('compare-verdicts');
    expect(await card.locator(`li[data-verdict="does-not-fit"]`).filter({ hasText: s44.planName }).innerText()).toContain(reason);
    await page.locator('.js-plotly-plot .main-svg').first().waitFor();
    await screenshot(page, 'verdicts-side-by-side');

    expect(errors).toEqual([]);
  }, 600_000);
});
