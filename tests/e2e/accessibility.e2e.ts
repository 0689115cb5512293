import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { ADMIN_USER } from '#server/services/demo';
import { baseUrl, screenshot, signIn, suiteBrowser } from './browser';

// Accessibility on every main page: axe-core (the well-known checker, injected into the page) finds
// no serious or critical violation of WCAG 2.0–2.2 A and AA, and at a 390 × 844 phone no page
// scrolls sideways. Signed out, the home page logs no console error at all (not even a 401).

// Evaluated through the browser's protocol rather than added as a <script>: the app's Content
// Security Policy (script-src 'self') rightly refuses inline scripts.
const axeSource = readFileSync(createRequire(import.meta.url).resolve('axe-core/axe.min.js'), 'utf8');
const { newPage, demoPage } = suiteBrowser(30_000);

interface AxeViolation {
  id: string;
  impact: string | null;
  help: string;
  nodes: { target: string[]; failureSummary?: string }[];
}

/** The serious and critical violations axe-core finds on the page as it is now, one line each. */
async function axeProblems(page: Page, name: string): Promise<string[]> {
  if (!(await page.evaluate(() => 'axe' in window))) await page.evaluate(axeSource);
  const violations = await page.evaluate(async () => {
    const axe = (window as unknown as { axe: { run: (ctx: Document, opts: unknown) => Promise<{ violations: AxeViolation[] }> } }).axe;
    // WCAG 2.0, 2.1 and 2.2, levels A and AA.
    const result = await axe.run(document, { runOnly: { type: 'tag', values: ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa'] } });
    return result.violations.map((v) => ({
      id: v.id,
      impact: v.impact,
      help: v.help,
      nodes: v.nodes.map((n) => ({ target: n.target, failureSummary: n.failureSummary })),
    }));
  });
  return violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map(
      (v) =>
        `${name}: ${v.id} (${v.impact}) ${v.help} at ${v.nodes
          .map((n) => n.target.join(' '))
          .slice(0, 4)
          .join(', ')}`,
    );
}

/** How far the page scrolls sideways past the screen, in CSS pixels (0 when it does not). */
async function sidewaysOverflow(page: Page): Promise<number> {
  return page.evaluate(() => document.scrollingElement!.scrollWidth - window.innerWidth);
}

/** Opens a page and waits for its first heading (the page has rendered its content). */
async function open(page: Page, path: string) {
  await page.goto(`${baseUrl()}${path}`);
  await page.locator('h1').first().waitFor();
  // Lazily loaded plots and tables settle.
  await page.waitForLoadState('networkidle');
}

/** Every main page of the signed-in demo owner, by a short name. */
async function demoPages(page: Page, teamId: string): Promise<[string, string][]> {
  const base = baseUrl();
  const list = (await (await page.request.get(`${base}/api/teams/${teamId}/studies`)).json()) as { studies: { id: string; title: string }[] };
  const studyId = list.studies[0].id;
  return [
    ['studies', `/teams/${teamId}/studies`],
    ['study', `/teams/${teamId}/studies/${studyId}`],
    ['side-by-side', `/teams/${teamId}/studies/${studyId}/compare`],
    ['report', `/teams/${teamId}/studies/${studyId}/report`],
    ['maps', `/teams/${teamId}/maps`],
    ['map', `/teams/${teamId}/maps/builtin-compressor-m58`],
    ['tracer', `/teams/${teamId}/tracer`],
    ['learn', '/learn'],
    ['teams', '/teams'],
    ['team', `/teams/${teamId}`],
    ['settings', '/settings'],
    ['sessions', '/settings/sessions'],
  ];
}

const SIGNED_OUT: [string, string][] = [
  ['home', '/'],
  ['sign-in', '/sign-in'],
  ['sign-up', '/sign-up'],
  ['forgot-password', '/forgot-password'],
];

const ADMIN: [string, string][] = [
  ['admin-users', '/admin/users'],
  ['admin-teams', '/admin/teams'],
  ['admin-outbox', '/admin/outbox'],
];

describe('accessibility and phone width on every main page', () => {
  it('signed out: the home page says what Spoolbook does, logs no console error, and the demo is a click away', async () => {
    const { page } = await newPage({ width: 1280, height: 860 });
    const consoleErrors: string[] = [];
    page.on('console', (m) => {
      if (m.type() === 'error') consoleErrors.push(m.text());
    });
    await open(page, '/');
    await page.getByRole('heading', { name: 'Know the turbo fits before you buy it.', level: 1 }).waitFor();
    await screenshot(page, 'landing');
    expect(consoleErrors).toEqual([]);
    // The test server is not a development server: no demo sign-in, so the button leads to an account.
    await page.getByTestId('open-demo').click();
    await page.waitForURL(/\/sign-up$/);
    expect(consoleErrors).toEqual([]);
  });

  it('signed-out pages: no serious or critical axe violation, no sideways scroll at 390 px', async () => {
    const { page } = await newPage({ width: 1280, height: 860 });
    const problems: string[] = [];
    for (const [name, path] of SIGNED_OUT) {
      await open(page, path);
      problems.push(...(await axeProblems(page, name)));
    }
    const phone = (await newPage({ width: 390, height: 844 })).page;
    const wide: string[] = [];
    for (const [name, path] of SIGNED_OUT) {
      await open(phone, path);
      const over = await sidewaysOverflow(phone);
      if (over > 0) wide.push(`${name}: ${over} px wider than the screen`);
    }
    expect(problems).toEqual([]);
    expect(wide).toEqual([]);
  });

  it('the demo owner’s pages: no serious or critical axe violation', async () => {
    const { page, teamId } = await demoPage({ width: 1440, height: 900 });
    const problems: string[] = [];
    for (const [name, path] of await demoPages(page, teamId)) {
      await open(page, path);
      problems.push(...(await axeProblems(page, name)));
    }
    expect(problems).toEqual([]);
  });

  it('the demo owner’s pages at 390 × 844: none scrolls sideways', async () => {
    const { page, teamId } = await demoPage({ width: 390, height: 844 });
    const wide: string[] = [];
    for (const [name, path] of await demoPages(page, teamId)) {
      await open(page, path);
      const over = await sidewaysOverflow(page);
      if (over > 0) {
        wide.push(`${name}: ${over} px wider than the screen`);
        await screenshot(page, `too-wide-${name}-phone`);
      }
    }
    expect(wide).toEqual([]);
  });

  it('the site admin’s pages: no serious or critical axe violation, no sideways scroll at 390 px', async () => {
    const { page } = await newPage({ width: 1280, height: 860 });
    await signIn(page, ADMIN_USER);
    const problems: string[] = [];
    for (const [name, path] of ADMIN) {
      await open(page, path);
      problems.push(...(await axeProblems(page, name)));
    }
    await page.setViewportSize({ width: 390, height: 844 });
    const wide: string[] = [];
    for (const [name, path] of ADMIN) {
      await open(page, path);
      const over = await sidewaysOverflow(page);
      if (over > 0) wide.push(`${name}: ${over} px wider than the screen`);
    }
    expect(problems).toEqual([]);
    expect(wide).toEqual([]);
  });

  it('the study page’s skip links reach the results and the inputs', async () => {
    const { page, teamId } = await demoPage({ width: 1440, height: 900 });
    const [, studyPath] = (await demoPages(page, teamId))[1];
    await open(page, studyPath);
    for (const [link, target] of [
      ['Skip to results', 'study-results'],
      ['Skip to inputs', 'study-inputs'],
    ]) {
      const skip = page.getByRole('link', { name: link });
      await skip.focus();
      await page.keyboard.press('Enter');
      await page.waitForFunction((id) => document.activeElement?.id === id, target);
    }
  });
});
