import { randomUUID } from 'node:crypto';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { baseUrl, screenshot, suiteBrowser } from './browser';

// The Drive view in the production build: the demo compressor study without a car, the car typed
// in and saved, the force per gear beside the traction limit, the usable boost written into a
// scenario as boost by gear, and the force lines moving down to what the tyres pass.

const root = path.resolve(import.meta.dirname, '..', '..');
const PLOT_TIMEOUT = 180_000;
const POLL = { timeout: 60_000 };

async function forceTraces(page: Page): Promise<{ name: string; y: (number | null)[] }[]> {
  return page
    .locator('.js-plotly-plot')
    .first()
    .evaluate((div) =>
      ((div as unknown as { data: { name?: string; y?: (number | null)[] }[] }).data ?? []).map((t) => ({ name: t.name ?? '', y: t.y ?? [] })),
    );
}

/** How far the highest force of a gear is over the traction limit drawn beside it, N (the limit barely changes with speed in first gear). */
const overLimit = (traces: { name: string; y: (number | null)[] }[], gear: string) => {
  const force = Math.max(...(traces.find((t) => t.name === gear)?.y.filter((y): y is number => y !== null) ?? [0]));
  const limit = Math.max(...(traces.find((t) => t.name === 'Traction limit')?.y.filter((y): y is number => y !== null) ?? [0]));
  return force - limit;
};

describe('the Drive view in the browser', () => {
  const suite = suiteBrowser(PLOT_TIMEOUT);

  it('takes the car, shows force against the traction limit, and writes the usable boost into a scenario', async () => {
    const base = baseUrl();
    const { page, errors, teamId } = await suite.demoPage({ width: 1440, height: 1000 });
    const document = JSON.parse(readFileSync(path.join(root, 'data', 'demo', 'hillclimb-study.json'), 'utf8')) as unknown;
    const title = `Drive ${randomUUID().slice(0, 8)}`;
    const created = await page.request.post(`${base}/api/teams/${teamId}/studies`, { data: { title, document }, headers: { Origin: base } });
    expect(created.status()).toBe(201);
    const { study } = (await created.json()) as { study: { id: string } };

    // From the study page, as a user goes.
    await page.goto(`${base}/teams/${teamId}/studies/${study.id}`);
    await page.getByRole('navigation', { name: 'Study tools' }).getByRole('link', { name: 'Drive' }).click();
    await page.waitForURL(/\/drive$/);
    await expect.poll(() => page.getByText('This study has no car yet').count(), POLL).toBe(1);

    // The demo's invented front-drive hatch (server/services/demo-drive.ts).
    const form = page.getByRole('group', { name: 'Vehicle' });
    await form.getByLabel('Driven wheels').selectOption('front');
    await form.getByLabel('Tyre grip preset').selectOption('semi-slick');
    const fill: [string, string][] = [
      ['Mass as it runs (kg)', '1080'],
      ['Weight on the driven axle at rest (%)', '62'],
      ['Centre of gravity height (m)', '0.5'],
      ['Wheelbase (m)', '2.55'],
      ['Tyre rolling radius (m)', '0.305'],
      ['Gear ratios, first gear first', '3.25, 2.05, 1.46, 1.12'],
      ['Final drive ratio', '4.2'],
      ['Shift up at (rpm)', '7800'],
    ];
    for (const [label, value] of fill) await form.getByLabel(label, { exact: true }).fill(value);
    // A slip is named beside its field, and nothing computes on it.
    await form.getByLabel('Tyre rolling radius (m)', { exact: true }).fill('30.5');
    await expect.poll(() => page.getByText('tyre radius is in m').count(), POLL).toBeGreaterThan(0);
    await form.getByLabel('Tyre rolling radius (m)', { exact: true }).fill('0.305');

    await page.getByRole('button', { name: 'Save the car' }).click();
    await expect.poll(() => page.getByRole('status').filter({ hasText: 'Saved as revision 2' }).count(), POLL).toBe(1);

    await expect.poll(async () => (await forceTraces(page)).map((t) => t.name), POLL).toEqual(['Gear 1', 'Gear 2', 'Gear 3', 'Gear 4', 'Traction limit']);
    await page.getByLabel('Plan', { exact: true }).selectOption({ label: 'M58 mid wheel' });
    await expect.poll(async () => overLimit(await forceTraces(page), 'Gear 2'), POLL).toBeGreaterThan(1000); // second gear beyond grip on full boost (by construction of the car)
    await screenshot(page, 'drive-before-writing');

    await page.getByLabel('Write into scenario').selectOption({ label: 'Sea level, 20 °C' });
    await page.getByRole('button', { name: 'Write as boost by gear' }).click();
    await expect.poll(() => page.getByRole('status').filter({ hasText: 'Saved as revision 3' }).count(), POLL).toBe(1);
    // The lines move: second gear now runs on the usable boost, its force down to the limit (within the torque estimate's slack).
    await expect.poll(async () => overLimit(await forceTraces(page), 'Gear 2'), POLL).toBeLessThan(500);
    await screenshot(page, 'drive-after-writing');

    // The study itself has the new rows: its operating lines are computed on them.
    const saved = (await (await page.request.get(`${base}/api/teams/${teamId}/studies/${study.id}`)).json()) as {
      study: { revision: number; document: { scenarios: { name: string; boostSchedule: { label: string }[] }[] } };
    };
    expect(saved.study.revision).toBe(3);
    expect(saved.study.document.scenarios[0].boostSchedule.map((r) => r.label)).toEqual([
      'Full load',
      "Gear 1 (tyres' grip)",
      "Gear 2 (tyres' grip)",
      "Gear 3 (tyres' grip)",
      "Gear 4 (tyres' grip)",
    ]);
    // The study page's verdicts name each plan's time to boost with the car (unknown here: the plans have no turbine).
    await page.goto(`${base}/teams/${teamId}/studies/${study.id}`);
    await expect.poll(() => page.getByTestId('verdict-time-to-boost').count(), POLL).toBe(3);
    expect(await page.getByTestId('verdict-time-to-boost').first().textContent()).toMatch(/unknown \(the plan has no exhaust side/);

    // The seeded turbine housing study has its rear-drive car: both housings get a time.
    const list = (await (await page.request.get(`${base}/api/teams/${teamId}/studies?q=housing`)).json()) as { studies: { id: string }[] };
    await page.goto(`${base}/teams/${teamId}/studies/${list.studies[0].id}`);
    await expect
      .poll(
        () =>
          page
            .getByTestId('verdict-time-to-boost')
            .filter({ hasText: /: \d[\d.]* s$/ })
            .count(),
        POLL,
      )
      .toBe(2);
    await screenshot(page, 'drive-verdicts-time-to-boost');
    expect(errors).toEqual([]);
  });
});
