import { mkdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { desc, eq } from 'drizzle-orm';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import { afterAll, beforeAll, inject } from 'vitest';
import { connectDatabase, type Database } from '#server/db/client';
import { outbox } from '#server/db/schema';
import { ADMIN_USER, DEMO_USER as DEMO_ACCOUNT, DEMO_TEAM_NAME } from '#server/services/demo';
import { parseMapFile } from '#shared/maps';
import type { SpoolbookMap } from '#shared/maps/types';

export const screenshotDir = path.resolve(import.meta.dirname, '..', '..', 'test-results', 'screenshots');

export function baseUrl(): string {
  return inject('baseUrl');
}

/** Debian's chromium with the flags this machine needs (no sandbox as root, no background traffic). */
export function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    args: [
      '--headless',
      '--no-sandbox',
      '--disable-gpu',
      '--disable-background-networking',
      '--disable-component-update',
      '--no-first-run',
      '--disable-sync',
      '--disable-quic',
    ],
  });
}

export async function screenshot(page: Page, name: string) {
  mkdirSync(screenshotDir, { recursive: true });
  await page.screenshot({ path: path.join(screenshotDir, `${name}.png`), fullPage: true });
}

let database: Database | null = null;
export function testDatabase(): Database {
  database ??= connectDatabase(process.env.DATABASE_URL!, { max: 2 });
  return database;
}
export async function closeTestDatabase() {
  await database?.pool.end();
  database = null;
}

/** The newest link with `pathPrefix` in a message the local mail catcher stored for `to`. */
export async function linkFromOutbox(to: string, pathPrefix: string): Promise<string> {
  for (let i = 0; i < 40; i++) {
    // Mail goes out through a queue: look through every message to `to`, newest first.
    const rows = await testDatabase().db.select().from(outbox).where(eq(outbox.to, to)).orderBy(desc(outbox.receivedAt));
    const escaped = pathPrefix.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
    for (const row of rows) {
      const m = row.text.match(new RegExp(`https?://\\S+${escaped}\\S+`));
      if (m) return m[0];
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`no mail to ${to} with a ${pathPrefix} link`);
}

/** Fails the test on any uncaught page error or console error (a broken bundle shows up here). */
export function watchForPageErrors(page: Page): string[] {
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(`pageerror: ${e.message}`));
  page.on('console', (m) => {
    if (m.type() === 'error' && !/Failed to load resource: the server responded with a status of 4\d\d/.test(m.text())) errors.push(`console: ${m.text()}`);
  });
  return errors;
}

/** The seeded demo owner and team. */
export const DEMO_USER = { ...DEMO_ACCOUNT, team: DEMO_TEAM_NAME };
/** The seeded site admin. */
export { ADMIN_USER };
/** A seeded editor of the demo team (server/services/demo.ts). */
export const DEMO_EDITOR = { email: 'rafael@spoolbook.test', password: 'spoolbook-demo' };

/**
 * Opens the sign-in page, fills the form and sends it, without waiting for where it leads (a
 * second factor may be asked next). Most tests want `signIn`.
 */
export async function submitSignIn(page: Page, who: { email: string; password: string }) {
  await page.goto(`${baseUrl()}/sign-in`);
  const form = page.getByRole('form', { name: 'Sign in' });
  await form.getByLabel('E-mail').fill(who.email);
  await form.getByLabel('Password', { exact: true }).fill(who.password);
  await form.getByRole('button', { name: 'Sign in' }).click();
}

/** Signs in through the form and waits to leave the sign-in page. */
export async function signIn(page: Page, who: { email: string; password: string } = DEMO_USER) {
  await submitSignIn(page, who);
  await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
}

/** A new account made through the API (the sign-up form has tests of its own); its first team's id. */
export async function signUpByApi(page: Page, who: { email: string; password: string; name: string }): Promise<string> {
  const res = await page.request.post(`${baseUrl()}/api/auth/sign-up`, { data: who, headers: { Origin: baseUrl() } });
  if (res.status() !== 201) throw new Error(`sign-up answered ${res.status()}`);
  return ((await res.json()) as { teams: { id: string }[] }).teams[0].id;
}

/** A number as the screens print it (shared formatNumber: en-US, grouped, 4 significant digits). */
export function shownNumber(value: number, digits = 4): string {
  return new Intl.NumberFormat('en-US', { maximumSignificantDigits: digits }).format(value);
}

/** A built-in demo map, read from data/maps/ as the server reads it. */
export function builtinMap(id: string): SpoolbookMap {
  const parsed = parseMapFile(readFileSync(path.join(import.meta.dirname, '..', '..', 'data', 'maps', `${id.replace(/^builtin-/, '')}.csv`), 'utf8'));
  if (!parsed.ok) throw new Error(`demo map ${id} does not parse`);
  return parsed.map;
}

/**
 * A browser for one describe block: launched before its tests and closed after them with every
 * context it opened. `newPage` gives a page in a fresh context, signed out; `demoPage` one signed
 * in as the demo owner, in SI units, with the demo team's id.
 */
export function suiteBrowser(timeout: number) {
  let browser: Browser | null = null;
  const contexts: BrowserContext[] = [];
  beforeAll(async () => {
    browser = await launchBrowser();
  });
  afterAll(async () => {
    for (const c of contexts) await c.close();
    await browser?.close();
    await closeTestDatabase();
  });
  async function newPage(viewport: { width: number; height: number }): Promise<{ page: Page; errors: string[] }> {
    const context = await browser!.newContext({ viewport });
    contexts.push(context);
    const page = await context.newPage();
    page.setDefaultTimeout(timeout);
    return { page, errors: watchForPageErrors(page) };
  }
  return {
    /** A page in a fresh context, signed out. */
    newPage,
    async demoPage(viewport: { width: number; height: number }): Promise<{ page: Page; errors: string[]; teamId: string }> {
      const { page, errors } = await newPage(viewport);
      await signIn(page);
      const base = baseUrl();
      const si = await page.request.patch(`${base}/api/auth/me`, { data: { unitSystem: 'si' }, headers: { Origin: base } });
      if (si.status() !== 200) throw new Error(`setting SI units answered ${si.status()}`);
      const me = (await (await page.request.get(`${base}/api/auth/me`)).json()) as { teams: { id: string; name: string }[] };
      const team = me.teams.find((t) => t.name === DEMO_USER.team);
      if (!team) throw new Error(`the demo user is not in "${DEMO_USER.team}"`);
      return { page, errors, teamId: team.id };
    },
  };
}
