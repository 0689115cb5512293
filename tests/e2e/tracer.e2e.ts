import { randomUUID } from 'node:crypto';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { baseUrl, closeTestDatabase, launchBrowser, screenshot, signUpByApi, watchForPageErrors } from './browser';

// The Tracer end to end: a built-in demo map is drawn by the app's own map plot, photographed as a
// PNG, opened in the Tracer, calibrated with the plot's known axis values, traced by clicking at
// the demo map's own points, and saved; the saved map must match the demo map within 1 % of each
// axis's span (the tolerance; clicking is good to about half a screen pixel).

const DEMO_MAP = 'builtin-compressor-m58';
const SPEED_LINES = [70000, 110000]; // rpm, two of the demo map's speed lines (data/maps/compressor-m58.csv)
const ISLAND = '70'; // the demo map's 70 % island
const TOLERANCE = 0.01; // of the axis span

interface MapPoint {
  correctedMassFlow: number;
  pressureRatio: number;
  efficiency: number | null;
  speed: number | null;
}
interface MapCurve {
  kind: string;
  label: string;
  points: MapPoint[];
}
interface Placed {
  flow: number;
  ratio: number;
  /** Pixel in the PNG. */
  x: number;
  y: number;
}

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await closeTestDatabase();
});

/**
 * Photographs the map plot of the demo map's page and works out where given data points are in
 * the photograph, from plotly's own axis conversion (`l2p`) and the plot's box.
 */
async function photographDemoMap(page: Page, teamId: string, points: { flow: number; ratio: number }[]) {
  await page.goto(`${baseUrl()}/teams/${teamId}/maps/${DEMO_MAP}`);
  const graph = page.locator('.js-plotly-plot').first();
  await graph.locator('.main-svg').first().waitFor({ timeout: 60_000 });
  await page.mouse.move(1, 1);
  await page.waitForTimeout(500);
  const layout = await graph.evaluate((el, pts) => {
    const gd = el as unknown as {
      _fullLayout: {
        xaxis: { range: [number, number]; l2p: (v: number) => number; _offset: number; title: { text: string } };
        yaxis: { range: [number, number]; l2p: (v: number) => number; _offset: number };
      };
    };
    const { xaxis, yaxis } = gd._fullLayout;
    const box = el.getBoundingClientRect();
    return {
      box: { x: box.x + window.scrollX, y: box.y + window.scrollY, width: box.width, height: box.height },
      xRange: xaxis.range,
      yRange: yaxis.range,
      xTitle: xaxis.title.text,
      pixels: pts.map((p) => ({ x: xaxis.l2p(p.flow) + xaxis._offset, y: yaxis.l2p(p.ratio) + yaxis._offset })),
    };
  }, points);
  // A new account shows SI units: the plot's flow axis is the map's corrected mass flow in kg/s.
  expect(layout.xTitle).toMatch(/Corrected mass flow \(kg\/s\)/);
  const clip = { x: Math.round(layout.box.x), y: Math.round(layout.box.y), width: Math.floor(layout.box.width), height: Math.floor(layout.box.height) };
  const png = await page.screenshot({ clip, fullPage: true });
  await screenshot(page, 'tracer-demo-map-source');
  const shift = { x: layout.box.x - clip.x, y: layout.box.y - clip.y };
  const placed = layout.pixels.map((p, i) => ({ ...points[i], x: p.x + shift.x, y: p.y + shift.y }));
  return { png, placed, xRange: layout.xRange, yRange: layout.yRange };
}

/** Clicks the canvas at a pixel of the picture, through the view the canvas reports. */
async function clickPicture(page: Page, pixel: { x: number; y: number }) {
  const canvas = page.locator('canvas[data-view-scale]');
  const box = (await canvas.boundingBox())!;
  const view = await canvas.evaluate((el) => ({ scale: Number(el.dataset.viewScale), x: Number(el.dataset.viewX), y: Number(el.dataset.viewY) }));
  await page.mouse.click(box.x + view.x + pixel.x * view.scale, box.y + view.y + pixel.y * view.scale);
}

/** Points of a line far enough apart on screen that each click adds a point instead of grabbing the last. */
function spaced<T extends { x: number; y: number }>(points: T[], minPixels = 14): T[] {
  const kept: T[] = [];
  for (const p of points) if (kept.every((k) => Math.hypot(k.x - p.x, k.y - p.y) >= minPixels)) kept.push(p);
  return kept;
}

describe('Tracer', () => {
  it('traces a demo map from a picture of it and saves a map that matches it', async () => {
    const context = await browser.newContext({ viewport: { width: 1600, height: 1000 }, deviceScaleFactor: 1 });
    const page = await context.newPage();
    const errors = watchForPageErrors(page);
    try {
      await traceTheDemoMap(page, errors);
    } catch (error) {
      await screenshot(page, 'tracer-failure');
      throw error;
    } finally {
      await context.close();
    }
  });
});

/** The whole walk: photograph, open, calibrate, come back, trace, save, compare. */
async function traceTheDemoMap(page: Page, errors: string[]) {
  const teamId = await signUpByApi(page, { email: `tracer-${randomUUID().slice(0, 8)}@example.test`, password: 'a long enough password', name: 'Tess Tracer' });

  // The demo map as the library serves it (SI model).
  const demo = (await (await page.request.get(`${baseUrl()}/api/teams/${teamId}/maps/${DEMO_MAP}`)).json()) as {
    map: { map: { reference: { temperature: number; pressure: number }; curves: MapCurve[] } };
  };
  const curves = demo.map.map.curves;
  const surge = curves.find((c) => c.kind === 'surge')!;
  const choke = curves.find((c) => c.kind === 'choke')!;
  const speeds = SPEED_LINES.map((s) => curves.find((c) => c.kind === 'speed' && c.points[0].speed === s)!);
  const island = curves.find((c) => c.kind === 'island' && c.label === ISLAND)!;
  const islandPoints = island.points.slice(0, -1).filter((_, i) => i % 8 === 0);
  const wanted = [surge.points, choke.points, ...speeds.map((s) => s.points), islandPoints];

  // Axis reference values: round numbers inside the plotted ranges, and the corner.
  const all = wanted.flat().map((p) => ({ flow: p.correctedMassFlow, ratio: p.pressureRatio }));
  const calibrationValues = [
    { flow: 0.05, ratio: 1 },
    { flow: 0.35, ratio: 1 },
    { flow: 0, ratio: 1.5 },
    { flow: 0, ratio: 3.5 },
    { flow: 0, ratio: 1 },
  ];
  const photo = await photographDemoMap(page, teamId, [...calibrationValues, ...all]);
  expect(photo.xRange[0]).toBe(0); // the plot starts its flow axis at zero…
  expect(photo.yRange[0]).toBe(1); // …and its pressure-ratio axis at 1 (compressor-map-figure.ts)
  const [x1, x2, y1, y2, corner] = photo.placed.slice(0, 5);
  let cursor = 5;
  const placedLines = wanted.map((line) => {
    const placed = photo.placed.slice(cursor, cursor + line.length);
    cursor += line.length;
    return placed;
  });

  // Open the picture in the Tracer.
  await page.goto(`${baseUrl()}/teams/${teamId}/tracer`);
  await page.getByRole('heading', { name: 'Tracer', level: 1 }).waitFor();
  await screenshot(page, 'tracer-home');
  await page.locator('input[type=file]').setInputFiles({ name: 'demo-m58.png', mimeType: 'image/png', buffer: photo.png });
  await page.waitForURL(/\/tracer\/[^/]+$/);
  await page.locator('canvas[data-view-scale]').waitFor();
  await page.getByText('Loading the picture…').waitFor({ state: 'detached' });

  // 1. The map: name, and the reference conditions as the demo file prints them (545 °R, 13.95 psi).
  await page.getByLabel('Map name').fill('M58 traced from a picture');
  await page.getByLabel('Reference temperature', { exact: true }).fill('545');
  await page.getByLabel('Reference temperature unit').selectOption('degR');
  await page.getByLabel('Reference pressure (absolute)', { exact: true }).fill('13.95');
  await page.getByLabel('Reference pressure unit').selectOption('psi');
  await screenshot(page, 'tracer-map-step');

  // 2. Calibrate: two points on each axis with their values, and the corner.
  await page.getByRole('button', { name: /^2\. Axes/ }).click();
  const reference = [
    { name: 'horizontal axis, point 1', label: 'Horizontal axis, point 1: flow', value: x1.flow, at: x1 },
    { name: 'horizontal axis, point 2', label: 'Horizontal axis, point 2: flow', value: x2.flow, at: x2 },
    { name: 'vertical axis, point 1', label: 'Vertical axis, point 1: pressure ratio', value: y1.ratio, at: y1 },
    { name: 'vertical axis, point 2', label: 'Vertical axis, point 2: pressure ratio', value: y2.ratio, at: y2 },
  ];
  for (const r of reference) {
    await page.getByLabel(r.label, { exact: true }).fill(String(r.value));
    await page.getByRole('button', { name: `Place ${r.name}`, exact: true }).click();
    await clickPicture(page, r.at);
  }
  await page.getByRole('button', { name: 'Place where the axes cross', exact: true }).click();
  await clickPicture(page, corner);
  const summary = page.getByText(/^Calibrated from 5 points: residual/);
  await summary.waitFor();
  // Clicks at the computed pixels agree to well under a pixel.
  const residual = Number(/residual ([\d.]+) px RMS/.exec((await summary.textContent()) ?? '')?.[1]);
  expect(residual).toBeLessThan(1);
  await screenshot(page, 'tracer-calibrated');

  // Stop half-way and come back: the draft is on the server.
  await page.getByText('Draft saved').waitFor();
  await page.reload();
  await page.getByRole('button', { name: /^3\. Lines/ }).waitFor();
  await page.getByRole('button', { name: /^2\. Axes/ }).click();
  await page.getByText(/^Calibrated from 5 points/).waitFor();
  await page.getByText('Loading the picture…').waitFor({ state: 'detached' });

  // 3. Trace the surge line, the choke limit, two speed lines and an island.
  await page.getByRole('button', { name: /^3\. Lines/ }).click();
  const traced: { add: string; value?: { label: string; text: string }; points: Placed[] }[] = [
    { add: 'Add surge line', points: spaced(placedLines[0]) },
    { add: 'Add choke limit', points: spaced(placedLines[1]) },
    { add: 'Add speed line', value: { label: 'Speed, line 3', text: String(SPEED_LINES[0]) }, points: spaced(placedLines[2]) },
    { add: 'Add speed line', value: { label: 'Speed, line 4', text: String(SPEED_LINES[1]) }, points: spaced(placedLines[3]) },
    { add: 'Add efficiency island', value: { label: 'Efficiency, line 5', text: ISLAND }, points: spaced(placedLines[4]) },
  ];
  for (const line of traced) {
    await page.getByRole('button', { name: line.add, exact: true }).click();
    if (line.value) await page.getByLabel(line.value.label).fill(line.value.text);
    for (const p of line.points) await clickPicture(page, p);
  }
  await page.mouse.move(5, 5);
  await screenshot(page, 'tracer-traced');

  // 4. The file: no problems, save to the library.
  await page.getByRole('button', { name: /^4\. File/ }).click();
  await page.getByText('The file is ready: it passes every check an upload gets.').waitFor();
  await screenshot(page, 'tracer-file');
  await page.getByRole('button', { name: 'Save to library' }).click();
  const open = page.getByRole('link', { name: 'Open the map' });
  await open.waitFor();
  const mapId = decodeURIComponent((await open.getAttribute('href'))!.split('/').pop()!);

  // The saved map matches the demo map's points within 1 % of each axis's span.
  const saved = (await (await page.request.get(`${baseUrl()}/api/teams/${teamId}/maps/${mapId}`)).json()) as {
    map: { name: string; map: { reference: { temperature: number; pressure: number }; curves: MapCurve[] } };
  };
  expect(saved.map.name).toBe('M58 traced from a picture');
  // The same reference conditions as the demo map, typed in its own units (545 °R, 13.95 psi).
  expect(Math.abs(saved.map.map.reference.temperature / demo.map.map.reference.temperature - 1)).toBeLessThan(1e-12);
  expect(Math.abs(saved.map.map.reference.pressure / demo.map.map.reference.pressure - 1)).toBeLessThan(1e-12);
  // The picture is kept with the map.
  const kept = (await (await page.request.get(`${baseUrl()}/api/teams/${teamId}/tracer/images?mapId=${mapId}`)).json()) as {
    images: { contentType: string }[];
  };
  expect(kept.images).toEqual([expect.objectContaining({ contentType: 'image/png' })]);
  const xSpan = photo.xRange[1] - photo.xRange[0];
  const ySpan = photo.yRange[1] - photo.yRange[0];
  const savedCurves = saved.map.map.curves;
  expect(savedCurves.map((c) => c.kind)).toEqual(['surge', 'choke', 'speed', 'speed', 'island']);
  savedCurves.forEach((curve, i) => {
    const clicked = traced[i].points;
    // Islands come back in click order, closed; lines in the file's order, which is the demo's.
    const got = curve.kind === 'island' ? curve.points.slice(0, -1) : curve.points;
    expect(got).toHaveLength(clicked.length);
    got.forEach((p, j) => {
      expect(Math.abs(p.correctedMassFlow - clicked[j].flow)).toBeLessThanOrEqual(TOLERANCE * xSpan);
      expect(Math.abs(p.pressureRatio - clicked[j].ratio)).toBeLessThanOrEqual(TOLERANCE * ySpan);
    });
    if (curve.kind === 'speed') expect(curve.points.every((p) => p.speed === SPEED_LINES[i - 2])).toBe(true);
    // 70 % read as a fraction (70 / 100 carries a last-digit rounding).
    if (curve.kind === 'island') expect(curve.points.every((p) => Math.abs(p.efficiency! - 0.7) < 1e-12)).toBe(true);
  });

  await open.click();
  await page.getByRole('heading', { name: 'M58 traced from a picture', level: 1 }).waitFor();
  await page.locator('.js-plotly-plot .main-svg').first().waitFor();
  await screenshot(page, 'tracer-saved-map');
  expect(errors).toEqual([]);
}
