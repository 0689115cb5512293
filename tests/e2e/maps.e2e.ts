import { readFileSync } from 'node:fs';
import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeTestDatabase, DEMO_USER, launchBrowser, screenshot, signIn, watchForPageErrors } from './browser';

// The map library in the production build: sign in as the demo user (owner of the seeded team
// "Harrow Hill Motorsport"), upload a demo map file, find it in the library, see it drawn, download
// it, read the problems of a broken file by line and column, and delete the map again.

const root = path.resolve(import.meta.dirname, '..', '..');
const DEMO = DEMO_USER;
const badFiles = path.join(root, 'tests', 'fixtures', 'maps', 'bad');

interface ExpectedProblem {
  code: string;
  line: number | null;
  column: number | null;
  message: string;
}
const expected = JSON.parse(readFileSync(path.join(badFiles, 'expected.json'), 'utf8')) as { files: Record<string, ExpectedProblem[]> };

/** The place words the problem list starts each problem with. */
function place(problem: ExpectedProblem): string {
  if (problem.line === null) return 'Whole file:';
  return problem.column === null ? `Line ${problem.line}:` : `Line ${problem.line}, column ${problem.column}:`;
}

// plotly.js is 4.6 MB and this machine may be busy: give the first plot time to arrive.
const PLOT_TIMEOUT = 120_000;

async function expectProblems(page: Page, file: string) {
  const problems = expected.files[file];
  expect(problems.length).toBeGreaterThan(0);
  const list = page.getByRole('list', { name: 'Problems in the file' });
  await list.waitFor();
  const items = list.getByRole('listitem');
  await expect.poll(() => items.count()).toBe(problems.length);
  for (const [i, problem] of problems.entries()) {
    const text = await items.nth(i).innerText();
    expect(text.startsWith(place(problem)), `problem ${i + 1} of ${file}: ${text}`).toBe(true);
    expect(text).toContain(problem.message);
  }
}

describe('map library in the browser', () => {
  let browser: Browser;

  beforeAll(async () => {
    browser = await launchBrowser();
  });

  afterAll(async () => {
    await browser?.close();
    await closeTestDatabase();
  });

  it('uploads a demo map, lists it, draws and exports it, downloads it, explains a broken file by line and column, renames and deletes the map', async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 900 }, acceptDownloads: true });
    const errors = watchForPageErrors(page);
    await signIn(page);

    // Maps opens the current team's library; the switcher moves it to the shared team.
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Maps' }).click();
    await page.waitForURL(/\/teams\/[^/]+\/maps$/);
    await page.getByRole('heading', { level: 1, name: 'Map library' }).waitFor();
    await page.getByLabel('Team', { exact: true }).selectOption({ label: DEMO.team });
    await page.locator('main').getByText(DEMO.team, { exact: true }).first().waitFor();
    const libraryUrl = page.url();
    // The built-in demo maps are listed beside the team's own (data/maps/ has four compressor maps).
    const demoTable = page.getByRole('table', { name: 'Built-in demo maps' });
    await demoTable.getByRole('link', { name: 'Spoolbook demo compressor M58' }).waitFor();

    // Upload: read and drawn in the browser at once, then saved under a name of this run.
    const name = `E2E M58 ${Date.now()}`;
    await page.getByLabel('Choose a map file').setInputFiles(path.join(root, 'data', 'maps', 'compressor-m58.csv'));
    await page.getByText('“compressor-m58.csv” reads as a compressor map with no problems.').waitFor();
    // Its islands meet on the surge line: the preview notes how those places are read (docs/map-format.md).
    await page.getByText(/^Whole file: \d+ places hold points with different efficiencies/).waitFor();
    await page
      .locator('section[aria-label="Preview of the chosen map"] .js-plotly-plot .main-svg')
      .first()
      .waitFor({ state: 'attached', timeout: PLOT_TIMEOUT });
    await page.getByLabel('Name', { exact: true }).fill(name);
    await page.getByRole('button', { name: 'Save to library' }).click();
    await page.getByText(`Saved “${name}” to the library.`).waitFor();

    const teamTable = page.getByRole('table', { name: "The team's maps" });
    await teamTable.getByRole('link', { name, exact: true }).waitFor();
    await screenshot(page, 'maps-library');

    // The map's own page: the plot with its speed lines labelled in krpm.
    await teamTable.getByRole('link', { name, exact: true }).click();
    await page.getByRole('heading', { level: 1, name }).waitFor();
    const plot = page.locator('figure[aria-label^="Compressor map"] .js-plotly-plot');
    await plot.locator('.main-svg').first().waitFor({ state: 'attached', timeout: PLOT_TIMEOUT });
    await expect
      .poll(() => plot.locator('.annotation-text').allTextContents(), { timeout: PLOT_TIMEOUT })
      // The seven speed lines of the M58 demo map, 45 000 to 135 000 rpm (data/maps/compressor-m58.csv).
      .toEqual(expect.arrayContaining(['45 krpm', '70 krpm', '80 krpm', '95 krpm', '110 krpm', '120 krpm', '135 krpm']));
    const legend = await plot.locator('.legendtext').allTextContents();
    expect(legend).toEqual(expect.arrayContaining(['Surge line', 'Choke limit', 'Speed lines', 'Efficiency islands']));
    // One trace per speed line, island, surge and choke line (7 + 6 + 1 + 1 in the file).
    expect(await plot.locator('.scatterlayer .trace').count()).toBe(15);
    await screenshot(page, 'maps-plot');

    // Export with our own buttons: an SVG drawing and a PNG image named after the map.
    const [svg] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Save SVG of the plot (a drawing)' }).click()]);
    expect(svg.suggestedFilename()).toBe(`${name.replace(/ /g, '-')}.svg`);
    expect(readFileSync(await svg.path(), 'utf8')).toContain('<svg');
    const [png] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Save PNG of the plot (an image)' }).click()]);
    expect(png.suggestedFilename()).toBe(`${name.replace(/ /g, '-')}.png`);
    // The PNG signature, first eight bytes of every PNG file (ISO/IEC 15948, 5.2).
    expect([...readFileSync(await png.path()).subarray(0, 8)]).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);

    // The volume-flow axis says what it is.
    await page.getByText('Inlet volume flow', { exact: true }).click();
    await expect.poll(() => plot.locator('.xtitle').textContent()).toContain('Inlet volume flow');

    // Download: the map file again, in the format, under its new name.
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: 'Download CSV' }).click()]);
    const downloaded = readFileSync(await download.path(), 'utf8');
    expect(downloaded.startsWith('# spoolbook-map: 1\n')).toBe(true);
    expect(downloaded).toContain(`# name: ${name}\n`);

    // A broken file: every problem by line and column, and nothing to save.
    await page.goto(libraryUrl);
    await page.getByLabel('Choose a map file').setInputFiles(path.join(badFiles, 'delimiter-semicolon-decimal-comma.csv'));
    await expectProblems(page, 'delimiter-semicolon-decimal-comma.csv');
    expect(await page.getByRole('button', { name: 'Save to library' }).count()).toBe(0);
    await page.getByLabel('Choose a map file').setInputFiles(path.join(badFiles, 'decimal-comma-quoted.csv'));
    await expectProblems(page, 'decimal-comma-quoted.csv');
    await screenshot(page, 'maps-bad-file');

    // Rename it and note where it came from; the library shows the new name.
    await page.getByRole('table', { name: "The team's maps" }).getByRole('link', { name, exact: true }).click();
    const renamed = `${name} (renamed)`;
    await page.getByLabel('Name', { exact: true }).fill(renamed);
    await page.getByLabel('Notes', { exact: true }).fill('Uploaded by the browser test.');
    await page.getByRole('button', { name: 'Save name and notes' }).click();
    await page.getByRole('heading', { level: 1, name: renamed }).waitFor();
    await page.getByRole('link', { name: /Map library/ }).click();
    await page.getByRole('table', { name: "The team's maps" }).getByRole('link', { name: renamed, exact: true }).click();

    // Delete the uploaded map: it leaves the library.
    await page.getByRole('button', { name: 'Delete map' }).click();
    await page.getByRole('dialog').getByRole('button', { name: 'Delete map' }).click();
    await page.waitForURL(libraryUrl);
    await page.getByRole('heading', { level: 1, name: 'Map library' }).waitFor();
    await page.getByRole('table', { name: 'Built-in demo maps' }).waitFor();
    await expect.poll(() => page.getByRole('link', { name: renamed, exact: true }).count()).toBe(0);

    expect(errors).toEqual([]);
    await page.close();
  }, 400_000);
});
