import { randomUUID } from 'node:crypto';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { migrateStudyDocument, studyDocumentSchema } from '#shared/schemas/study';
import { compareLines } from '#shared/study/compare';
import { runStudyDocument } from '#shared/study/run';
import { baseUrl, builtinMap, screenshot, shownNumber, suiteBrowser } from './browser';

// The exhaust side in the production build: a study with a single-scroll plan (one gate) and a
// divided-housing plan (two gates) shows both predicted boost curves beside their targets, the
// turbine map with its operating points, a finding when a gate is made too small, and the
// exhaust rows of Side by side. The study is the seeded turbine-housing demo, made through the API.

const root = path.resolve(import.meta.dirname, '..', '..');
const PLOT_TIMEOUT = 180_000;
/** Polls wait as long as a plot may take on a busy machine. */
const POLL = { timeout: 60_000 };

/** The traces plotly drew in the figure under `selector`: name and y values. */
async function traces(page: Page, selector: string): Promise<{ name: string; x: number[]; y: (number | null)[]; dash: string | null }[]> {
  return page
    .locator(`${selector} .js-plotly-plot`)
    .first()
    .evaluate((div) =>
      ((div as unknown as { data: { name?: string; x?: number[]; y?: (number | null)[]; line?: { dash?: string } }[] }).data ?? []).map((t) => ({
        name: t.name ?? '',
        x: t.x ?? [],
        y: t.y ?? [],
        dash: t.line?.dash ?? null,
      })),
    );
}

describe('the exhaust side in the browser', () => {
  const suite = suiteBrowser(PLOT_TIMEOUT);

  it('shows both predicted boost curves, the turbine map, a too-small gate, and the exhaust rows side by side', async () => {
    const base = baseUrl();
    const { page, errors, teamId } = await suite.demoPage({ width: 1440, height: 1000 });
    const origin = { Origin: base };

    // A study of our own from the turbine-housing demo document (data/demo/turbine-housing-study.json).
    const document = JSON.parse(readFileSync(path.join(root, 'data', 'demo', 'turbine-housing-study.json'), 'utf8')) as unknown;
    const title = `Exhaust side ${randomUUID().slice(0, 8)}`;
    const created = await page.request.post(`${base}/api/teams/${teamId}/studies`, { data: { title, document }, headers: origin });
    expect(created.status()).toBe(201);
    const { study } = (await created.json()) as { study: { id: string; document: unknown } };
    const doc = studyDocumentSchema.parse(migrateStudyDocument(study.document));
    const [single, divided] = doc.plans;
    expect(single.exhaust?.housing).toBe('single');
    expect(divided.exhaust?.housing).toBe('divided');
    expect(divided.exhaust?.wastegates.count).toBe(2);

    // The same document run in node with the same built-in maps: what the page must show.
    const maps = Object.fromEntries(
      doc.plans.flatMap((p) => [p.compressorMapId, p.turbineMapId].filter((id): id is string => !!id).map((id) => [id, builtinMap(id)])),
    );
    const result = runStudyDocument(doc, maps);
    const lineOf = (planIndex: number) => result.lines.find((l) => l.planIndex === planIndex && l.scenarioIndex === 0 && l.rowIndex === 0)!;
    // The demo holds its target only from some speed on (a turbine that big does not spool at 2500 rpm):
    // otherwise there would be no predicted boost curve apart from the target to see.
    for (const p of [0, 1]) {
      expect(lineOf(p).exhaust?.boostThresholdRpm).toBeGreaterThan(doc.engine.rpm.kind === 'range' ? doc.engine.rpm.min : 0);
      expect(lineOf(p).points.some((pt) => pt.values?.targetHeld === false)).toBe(true);
    }

    // ——— The study page: turbine map with the operating points of both plans (each on its own map).
    await page.goto(`${base}/teams/${teamId}/studies/${study.id}`);
    const turbineCard = page.getByTestId('study-turbine-map');
    await turbineCard.locator('.js-plotly-plot .main-svg').first().waitFor();
    const onTurbineMap = await traces(page, '[data-testid="study-turbine-map"]');
    const label0 = `${single.name} · ${doc.scenarios[0].name} · ${doc.scenarios[0].boostSchedule[0].label}`;
    expect(onTurbineMap.map((t) => t.name)).toContain(label0);
    // Choose the divided plan's map: its lines are drawn on it instead.
    const mapChoice = turbineCard.getByLabel('Map drawn');
    const options = await mapChoice.locator('option').allInnerTexts();
    await mapChoice.selectOption({ label: options.find((o) => o.startsWith(`${divided.name}:`))! });
    const label1 = `${divided.name} · ${doc.scenarios[0].name} · ${doc.scenarios[0].boostSchedule[0].label}`;
    await expect.poll(async () => (await traces(page, '[data-testid="study-turbine-map"]')).map((t) => t.name), POLL).toContain(label1);

    // One line of the exhaust summary per plan × scenario, each with where full boost arrives.
    const summary = page.getByTestId('exhaust-summary');
    await expect.poll(() => summary.locator('tbody tr').count(), POLL).toBe(result.lines.length);
    expect(await summary.locator('tbody tr').first().innerText()).toContain(`${shownNumber(lineOf(0).exhaust!.boostThresholdRpm!, 21)} rpm`);

    // ——— Boost against rpm: the boost each turbine holds (solid) beside the target (dotted), both plans.
    const curves = page.getByTestId('rpm-curves');
    await curves.getByRole('button', { name: 'Boost', exact: true }).click();
    await curves.locator('.js-plotly-plot .main-svg').first().waitFor();
    const boostTraces = await traces(page, '[data-testid="rpm-curves"]');
    for (const [planIndex, label] of [
      [0, label0],
      [1, label1],
    ] as const) {
      const held = boostTraces.find((t) => t.name === label)!;
      const target = boostTraces.find((t) => t.name === `${label} · boost target`)!;
      expect(held, `the held boost of ${label}`).toBeTruthy();
      expect(target, `the boost target of ${label}`).toBeTruthy();
      expect(target.dash).toBe('dot');
      const line = lineOf(planIndex);
      const first = line.points.find((p) => p.values?.targetHeld === false)!;
      const i = held.x.findIndex((x) => x === first.rpm);
      expect(held.y[i]).toBeCloseTo(first.values!.boost / 1000, 6); // kPa gauge on the SI screen
      expect(target.y[i]).toBeCloseTo(first.values!.boostTarget! / 1000, 6);
      expect(held.y[i]!).toBeLessThan(target.y[i]!); // below the threshold the turbine holds less than the target
    }
    // The exhaust views are offered beside the compressor ones.
    await curves.getByRole('button', { name: 'Exhaust pressure' }).click();
    await expect.poll(async () => (await traces(page, '[data-testid="rpm-curves"]')).length, POLL).toBeGreaterThanOrEqual(8); // 2 panels × 4 lines
    await screenshot(page, 'exhaust-study');

    // ——— A gate made too small gives a finding: the single-scroll plan needs more than 20 mm at 8000 rpm.
    const needed = lineOf(0).exhaust!.wastegateDiameterNeeded!.value;
    expect(needed).toBeGreaterThan(0.02); // so 20 mm is too small (the run above)
    const plan0 = page.getByTestId('plan-0');
    const valve = plan0.getByLabel('Valve diameter (each gate)');
    expect(await valve.inputValue()).toBe('44'); // 0.044 m in the demo document
    await valve.fill('20');
    const findings = page.getByTestId('findings');
    await findings.getByText('Wastegate too small').first().waitFor();
    await screenshot(page, 'exhaust-study-small-gate');
    // The divided plan's fields read back from its document.
    const plan1 = page.getByTestId('plan-1');
    expect(await plan1.getByLabel('Turbine housing').inputValue()).toBe('divided');
    expect(await plan1.getByLabel('Pulse-energy factor').inputValue()).toBe('1.1');
    // Back to the saved size, so nothing is left unsaved when the page is left.
    await valve.fill('44');
    await expect.poll(() => findings.getByText('Wastegate too small').count(), POLL).toBe(0);

    // ——— Side by side: both plans at the first scenario; the exhaust rows, as compareLines gives them.
    await page.goto(`${base}/teams/${teamId}/studies/${study.id}/compare`);
    const table = page.getByTestId('differences-table');
    await table.waitFor();
    await expect.poll(() => table.locator('thead th').count(), POLL).toBe(3 + 2);
    const rows = compareLines([lineOf(0), lineOf(1)]);
    const threshold = rows.find((r) => r.key === 'boostThresholdRpm')!;
    const dpr = rows.find((r) => r.key === 'peakDrivePressureRatio')!;
    const gate = rows.find((r) => r.key === 'wastegateDiameterNeeded')!;
    const p3 = rows.find((r) => r.key === 'turbineInletPressureAtPeakPower')!;
    for (const [i, cell] of threshold.cells.entries())
      expect(
        await table
          .locator('tr[data-row="boostThresholdRpm"] td')
          .nth(2 + i)
          .innerText(),
      ).toContain(shownNumber(cell.value!, 21));
    for (const [i, cell] of dpr.cells.entries())
      expect(
        await table
          .locator('tr[data-row="peakDrivePressureRatio"] td')
          .nth(2 + i)
          .innerText(),
      ).toContain(shownNumber(cell.value!));
    for (const [i, cell] of gate.cells.entries())
      expect(
        await table
          .locator('tr[data-row="wastegateDiameterNeeded"] td')
          .nth(2 + i)
          .innerText(),
      ).toContain(shownNumber(cell.value! * 1000)); // m → mm
    for (const [i, cell] of p3.cells.entries())
      expect(
        await table
          .locator('tr[data-row="turbineInletPressureAtPeakPower"] td')
          .nth(2 + i)
          .innerText(),
      ).toContain(shownNumber(cell.value! / 1000)); // Pa → kPa
    expect(await table.locator('tr[data-row="turbineInletPressureAtPeakPower"] td').first().innerText()).toContain('abs');
    // Each chosen plan on its own turbine map: the first drawn, the other chosen.
    await page.getByTestId('compare-turbine-map').locator('.js-plotly-plot .main-svg').first().waitFor();
    expect((await traces(page, '[data-testid="compare-turbine-map"]')).map((t) => t.name)).toContain(label0);
    // Both predicted boost curves beside their targets, side by side too.
    await page.getByTestId('compare-curves').locator('.js-plotly-plot .main-svg').first().waitFor();
    const compared = (await traces(page, '[data-testid="compare-curves"]')).map((t) => t.name);
    for (const label of [label0, label1]) {
      expect(compared).toContain(label);
      expect(compared).toContain(`${label} · boost target`);
    }
    await screenshot(page, 'exhaust-side-by-side');

    expect(errors).toEqual([]);
  }, 600_000);
});
