import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { baseUrl, DEMO_EDITOR, DEMO_USER, launchBrowser, screenshot, signIn, watchForPageErrors } from './browser';

// The study workspace in Chromium against the production build: a fresh study made through the
// UI (so this test owns it), a change of volumetric efficiency that moves the operating line, the
// same point in other units, a save, the history, and a second person saving from the same base
// revision who meets the conflict dialog.

/** The line and speed the test follows: the first plan of the demo study, first scenario, full load. */
const LINE_LABEL = 'S44 street wheel · Sea level, 20 °C · Full load';
const LINE_KEY = 'plan-s44|0|0';
const RPM = 4500;
/** 1 kg/s in lb/min: 60 s/min ÷ 0.45359237 kg/lb (NIST SP 811, Appendix B.8, pound avoirdupois). */
const LB_PER_MIN_PER_KG_PER_S = 60 / 0.45359237;

let browser: Browser;

/** A page in `context`, signed in as `who`, on the studies page. */
async function signedInPage(context: BrowserContext, who: { email: string; password: string }): Promise<Page> {
  const page = await context.newPage();
  page.setDefaultTimeout(60_000);
  await signIn(page, who);
  await page.waitForURL(/\/studies/);
  return page;
}

async function demoTeamId(page: Page): Promise<string> {
  const me = (await (await page.request.get(`${baseUrl()}/api/auth/me`)).json()) as { teams: { id: string; name: string }[] };
  const team = me.teams.find((t) => t.name === DEMO_USER.team);
  if (!team) throw new Error(`the demo user is not in "${DEMO_USER.team}"`);
  return team.id;
}

/** Sets the signed-in user's unit system through the header switch and waits for it to take. */
async function switchUnits(page: Page, system: 'SI' | 'US customary') {
  const button = page.getByRole('button', { name: `${system} units` });
  if ((await button.getAttribute('aria-pressed')) !== 'true') await button.click();
  await page.waitForFunction((name) => document.querySelector(`button[aria-label="${name} units"]`)?.getAttribute('aria-pressed') === 'true', system);
}

/** Corrected mass flow of the followed point as the compressor map plots it (the x of the point). */
async function plottedFlow(page: Page): Promise<number> {
  return page.evaluate(
    ({ label, rpm }) => {
      const gd = document.querySelector('[data-testid="study-map"] .js-plotly-plot') as
        (HTMLElement & { data?: { name?: string; x?: number[]; customdata?: [string, number][] }[] }) | null;
      const trace = gd?.data?.find((t) => t.name === label);
      const i = trace?.customdata?.findIndex((c) => c[1] === rpm) ?? -1;
      return trace && i >= 0 ? trace.x![i] : Number.NaN;
    },
    { label: LINE_LABEL, rpm: RPM },
  );
}

async function waitForPlottedLine(page: Page) {
  await page.waitForFunction(
    (label) => {
      const gd = document.querySelector('[data-testid="study-map"] .js-plotly-plot') as (HTMLElement & { data?: { name?: string }[] }) | null;
      return gd?.data?.some((t) => t.name === label) ?? false;
    },
    LINE_LABEL,
    { timeout: 90_000 },
  );
}

/** The results table's corrected mass flow of the followed point, as shown (4 significant figures). */
async function tableFlow(page: Page): Promise<number> {
  const cell = page.locator(`tr[data-row="${LINE_KEY}@${RPM}"] td[data-column="correctedMassFlow"]`);
  const text = (await cell.textContent()) ?? '';
  return Number(text.replace(/,/g, ''));
}

async function showTableRowOfPoint(page: Page) {
  const table = page.getByTestId('results-table');
  await table.scrollIntoViewIfNeeded();
  await page.getByLabel('Lines shown').selectOption({ label: LINE_LABEL });
  await page.locator(`tr[data-row="${LINE_KEY}@${RPM}"]`).waitFor();
}

beforeAll(async () => {
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
});

describe('study workspace', () => {
  it('moves the operating line with the volumetric efficiency, shows the point in both unit systems, saves, keeps the history, and stops a second save from the same revision', async () => {
    const contextA = await browser.newContext({ viewport: { width: 1600, height: 1000 } });
    const contextB = await browser.newContext({ viewport: { width: 1600, height: 1000 } });
    const a = await signedInPage(contextA, DEMO_USER);
    const errorsA = watchForPageErrors(a);
    const teamId = await demoTeamId(a);
    /** Studies this test made, deleted at the end through the owner's session. */
    const made: string[] = [];
    try {
      await switchUnits(a, 'SI');

      // A fresh study from the demo, made through the list page.
      await a.goto(`${baseUrl()}/teams/${teamId}/studies`);
      await a.getByRole('heading', { name: 'Studies', level: 1 }).waitFor();
      await a.getByRole('button', { name: 'New study' }).click();
      const title = `Browser test study ${Date.now()}`;
      const dialog = a.getByRole('dialog', { name: 'New study' });
      await dialog.getByLabel('Title', { exact: true }).fill(title);
      await dialog.getByRole('button', { name: 'Create study' }).click();
      await a.waitForURL(/\/studies\/[^/]+$/);
      const studyId = a.url().split('/').pop()!;
      made.push(studyId);
      await a.getByRole('heading', { name: title, level: 1 }).waitFor();
      await waitForPlottedLine(a);

      // The editor of the team opens the same study now, at the same revision 1.
      const b = await signedInPage(contextB, DEMO_EDITOR);
      const errorsB = watchForPageErrors(b);
      await b.goto(`${baseUrl()}/teams/${teamId}/studies/${studyId}`);
      await b.getByRole('heading', { name: title, level: 1 }).waitFor();
      await b.getByTestId('ve-table').waitFor();

      // The plotted point before and after raising the volumetric efficiency at 4500 rpm.
      const before = await plottedFlow(a);
      expect(before).toBeGreaterThan(0);
      await screenshot(a, 'study-page');
      const ve = a.getByTestId(`ve-table-value-${RPM}`);
      expect(await ve.inputValue()).toBe('101'); // the demo study's VE at 4500 rpm (data/demo/hillclimb-study.json)
      await ve.fill('110');
      await a.waitForFunction(
        ({ label, rpm, old }) => {
          const gd = document.querySelector('[data-testid="study-map"] .js-plotly-plot') as
            (HTMLElement & { data?: { name?: string; x?: number[]; customdata?: [string, number][] }[] }) | null;
          const trace = gd?.data?.find((t) => t.name === label);
          const i = trace?.customdata?.findIndex((c) => c[1] === rpm) ?? -1;
          return trace !== undefined && i >= 0 && trace.x![i] !== old;
        },
        { label: LINE_LABEL, rpm: RPM, old: before },
        { timeout: 60_000 },
      );
      const after = await plottedFlow(a);
      // More air per stroke at the same boost: the point moves right. Not exactly by 110/101, since the
      // manifold temperature follows where the point lands on the map (common practice, no source).
      expect(after / before).toBeGreaterThan(1.04);
      expect(after / before).toBeLessThan(1.12);
      await expect.poll(() => a.getByTestId('save-status').textContent()).toBe('Unsaved changes.');

      // The same point in the results table: kg/s, then lb/min after switching the whole app to US units.
      await showTableRowOfPoint(a);
      // The table follows the map a moment later (it renders after the plot): wait for the new value.
      await expect.poll(async () => Math.abs((await tableFlow(a)) - after) / after, { timeout: 30_000 }).toBeLessThan(1e-3); // 4 significant figures of the plotted value
      const flowSi = await tableFlow(a);
      await switchUnits(a, 'US customary');
      await a.getByText('(lb/min)').first().waitFor();
      // Both cells are rounded to 4 significant figures, hence the tolerance.
      await expect
        .poll(async () => Math.abs((await tableFlow(a)) / flowSi - LB_PER_MIN_PER_KG_PER_S) / LB_PER_MIN_PER_KG_PER_S, { timeout: 30_000 })
        .toBeLessThan(2e-3);
      expect(await ve.inputValue()).toBe('110'); // a percentage reads the same in both systems
      await switchUnits(a, 'SI');
      await a.getByText('(kg/s)').first().waitFor();

      // The Working of a point picked from the findings.
      await a.getByTestId('findings').locator('li button').first().click();
      const working = a.getByTestId('working-panel');
      await working.getByText('Corrected mass flow').first().waitFor();
      await working.scrollIntoViewIfNeeded();
      await screenshot(a, 'study-working');

      // Save with a message: revision 2.
      await a.getByLabel('What changed (optional)').fill('VE 110 % at 4500 rpm');
      await a.getByRole('button', { name: 'Save revision 2' }).click();
      await expect.poll(() => a.getByTestId('save-status').textContent(), { timeout: 30_000 }).toBe('All changes saved.');
      await expect.poll(() => a.getByTestId('revision-line').textContent()).toContain('revision 2');

      // The history lists it, and shows what changed from revision 1.
      await a.getByRole('button', { name: 'History' }).click();
      const history = a.getByTestId('history-panel');
      await history.locator('[data-revision="2"]').getByText('VE 110 % at 4500 rpm').waitFor();
      await history.getByLabel('Compare revision 1').check();
      await history.getByLabel('Compare revision 2').check();
      const change = history.getByTestId('change-list').getByRole('row', { name: /volumetric efficiency at 4500 rpm/ });
      await change.waitFor();
      expect(await change.textContent()).toMatch(/101 %.*110 %/);

      // The editor, still on revision 1, changes the displacement and saves: the conflict dialog.
      const displacement = b.getByTestId('section-engine').getByLabel('Displacement');
      await displacement.fill('2.1');
      await b.getByRole('button', { name: 'Save revision 2' }).click();
      const conflict = b.getByRole('dialog', { name: 'Someone saved this study first' });
      await conflict.waitFor({ timeout: 30_000 });
      expect(await conflict.getByTestId('conflict-description').textContent()).toMatch(/saved revision 2 .*after revision 1/);
      await conflict.getByRole('row', { name: /displacement/ }).waitFor();
      await screenshot(b, 'study-conflict');

      // Keeping theirs as a copy loses nothing: a new study with the editor's displacement.
      await conflict.getByRole('button', { name: 'Keep mine as a copy' }).click();
      await conflict.getByRole('button', { name: 'Save mine as a new study' }).click();
      await b.waitForURL((url) => !url.pathname.endsWith(studyId) && /\/studies\/[^/]+$/.test(url.pathname));
      const copyId = b.url().split('/').pop()!;
      made.push(copyId);
      await b.getByRole('heading', { name: `${title} (my version)`, level: 1 }).waitFor();
      expect(await b.getByTestId('section-engine').getByLabel('Displacement').inputValue()).toBe('2.1');
      // …and the original still holds the first person's revision 2.
      const original = (await (await b.request.get(`${baseUrl()}/api/teams/${teamId}/studies/${studyId}`)).json()) as {
        study: { revision: number; document: { engine: { displacement: number } } };
      };
      expect(original.study.revision).toBe(2);
      expect(original.study.document.engine.displacement).toBe(0.001998); // the demo study's displacement, m³

      expect(errorsA).toEqual([]);
      expect(errorsB).toEqual([]);
    } finally {
      await switchUnits(a, 'SI').catch(() => undefined);
      for (const id of made)
        await a.request.delete(`${baseUrl()}/api/teams/${teamId}/studies/${id}`, { headers: { Origin: baseUrl() } }).catch(() => undefined);
      await contextB.close();
      await contextA.close();
    }
  }, 400_000);
});
