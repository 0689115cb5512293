/**
 * In Chromium: from an input change on the study page to the updated compressor-map plot painted,
 * for the demo study (3 plans × 4 scenarios, 6 boost rows). Target (printed, not asserted): under
 * 50 ms median. Runs the production client build (built first when missing) served by the real
 * server over the bench database.
 *
 *   npm run bench study-paint
 */
import { existsSync } from 'node:fs';
import { createServer } from 'node:http';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import pino from 'pino';
import { chromium } from 'playwright-core';
import { createApp } from '#server/app';
import { loadConfig } from '#server/config';
import { connectDatabase } from '#server/db/client';
import { DEMO_STUDY_TITLE, DEMO_TEAM_NAME, DEMO_USER } from '#server/services/demo';
import { createMailer } from '#server/mail/mailer';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', '..');
const RUNS = Number(process.env.BENCH_RUNS ?? 30);
const RPM = 4500;

function stats(values: number[]) {
  const s = [...values].sort((a, b) => a - b);
  const at = (q: number) => s[Math.min(s.length - 1, Math.floor(q * (s.length - 1)))];
  return { median: at(0.5), p10: at(0.1), p90: at(0.9) };
}

async function main() {
  if (!existsSync(path.join(root, 'dist', 'client', 'index.html'))) {
    const { build } = await import('vite');
    await build({ root, logLevel: 'warn', configFile: path.join(root, 'vite.config.ts') });
  }
  // Listen first: the app's origin check needs the real port in its configuration.
  const server = createServer();
  server.listen(0, '127.0.0.1');
  await new Promise((r) => server.once('listening', r));
  const port = (server.address() as AddressInfo).port;
  const config = { ...loadConfig({ ...process.env, PORT: String(port) }), logLevel: 'silent' };
  const database = connectDatabase(config.databaseUrl, { max: 5 });
  const { app } = createApp({ database, config, mailer: createMailer('smtp://127.0.0.1:9', config.mailFrom), logger: pino({ level: 'silent' }) });
  server.on('request', app);
  const base = `http://127.0.0.1:${port}`;
  const browser = await chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--no-first-run'],
  });
  try {
    const page = await browser.newPage({ viewport: { width: 1440, height: 1000 } });
    await page.goto(`${base}/sign-in`);
    const form = page.getByRole('form', { name: 'Sign in' });
    await form.getByLabel('E-mail').fill(DEMO_USER.email);
    await form.getByLabel('Password').fill(DEMO_USER.password);
    await form.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('link', { name: 'Team' }).first().waitFor();
    const where = await page.evaluate(
      async ({ teamName, title }) => {
        const me = await (await fetch('/api/auth/me')).json();
        const team = me.teams.find((t: { name: string }) => t.name === teamName);
        const list = await (await fetch(`/api/teams/${team.id}/studies?q=${encodeURIComponent(title)}`)).json();
        return { teamId: team.id as string, studyId: list.studies[0].id as string };
      },
      { teamName: DEMO_TEAM_NAME, title: DEMO_STUDY_TITLE },
    );
    await page.goto(`${base}/teams/${where.teamId}/studies/${where.studyId}`);
    await page.getByTestId(`ve-table-value-${RPM}`).waitFor({ timeout: 120_000 });
    await page.waitForFunction(() => (document.querySelector('[data-testid="study-map"] .js-plotly-plot') as { data?: unknown[] } | null)?.data?.length, null, {
      timeout: 120_000,
    });

    const times: number[] = [];
    for (let i = 0; i < RUNS + 3; i++) {
      const value = String(101 + (i % 2) + 1);
      const ms = await page.evaluate(
        ({ rpm, value }) =>
          new Promise<number>((resolve, reject) => {
            const gd = document.querySelector('[data-testid="study-map"] .js-plotly-plot') as
              (HTMLElement & { on?: (e: string, f: () => void) => void; removeAllListeners?: (e: string) => void }) | null;
            const input = document.querySelector(`[data-testid="ve-table-value-${rpm}"]`) as HTMLInputElement | null;
            if (!gd?.on || !input) return reject(new Error('the study page has no map plot or VE input'));
            const setValue = Object.getOwnPropertyDescriptor(HTMLInputElement.prototype, 'value')!.set!;
            const timer = setTimeout(() => reject(new Error('the plot did not redraw within 10 s')), 10_000);
            let t0 = 0;
            gd.on('plotly_afterplot', () => {
              // The frame after the redraw is the one painted on screen.
              requestAnimationFrame(() => {
                clearTimeout(timer);
                gd.removeAllListeners?.('plotly_afterplot');
                resolve(performance.now() - t0);
              });
            });
            t0 = performance.now();
            setValue.call(input, value);
            input.dispatchEvent(new Event('input', { bubbles: true }));
          }),
        { rpm: RPM, value },
      );
      if (i >= 3) times.push(ms); // the first few warm up the page's code paths
      await page.waitForTimeout(100);
    }
    const s = stats(times);
    console.log(`Chromium, demo study (3 plans × 4 scenarios), VE edit at ${RPM} rpm → map plot painted`);
    console.log(
      `input change to painted plot   median ${s.median.toFixed(1)} ms   p10–p90 ${s.p10.toFixed(1)}–${s.p90.toFixed(1)} ms   runs ${times.length}   (target under 50 ms median)`,
    );
  } finally {
    await browser.close();
    server.close();
    await database.pool.end();
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
