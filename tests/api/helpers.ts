import { desc, eq } from 'drizzle-orm';
import { randomUUID } from 'node:crypto';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { expect } from 'vitest';
import pino from 'pino';
import request from 'supertest';
import { createApp } from '#server/app';
import { loadConfig, type Config } from '#server/config';
import { connectDatabase, type Database } from '#server/db/client';
import { outbox, users } from '#server/db/schema';
import { ADMIN_USER } from '#server/services/demo';
import type { LimitSettings } from '#server/services/limits';
import { startFakeSmtp } from '#server/mail/fake-smtp';
import { createMailer } from '#server/mail/mailer';

export const ORIGIN = 'http://127.0.0.1:3000';

export interface TestApp {
  app: ReturnType<typeof createApp>['app'];
  deps: ReturnType<typeof createApp>['deps'];
  database: Database;
  config: Config;
  /** Work left after answering (a reset request's lookup) done, and every queued message sent. */
  drainMail: () => Promise<void>;
  close: () => Promise<void>;
}

/**
 * The real app over the real (disposable) test database, with mail caught by the real fake SMTP
 * server. Rate limits count in PostgreSQL under a namespace of this app's own, so test files
 * running side by side (all from 127.0.0.1) do not count together.
 */
export async function startTestApp(overrides: Partial<Config> = {}, limitSettings: Partial<LimitSettings> = {}): Promise<TestApp> {
  if (!process.env.DATABASE_URL) throw new Error('DATABASE_URL is not set: run the API tests through `npm test`.');
  const config = { ...loadConfig({ ...process.env, PORT: '3000', HOST: '127.0.0.1', PUBLIC_URL: ORIGIN }), authRateLimit: 1000, ...overrides };
  const database = connectDatabase(config.databaseUrl, { max: 5 });
  const smtp = await startFakeSmtp(database.db, 0);
  const mailer = createMailer(`smtp://127.0.0.1:${smtp.port}`, config.mailFrom);
  const { app, deps } = createApp({
    database,
    config,
    mailer,
    logger: pino({ level: 'silent' }),
    limitSettings: {
      invitationsPerTeam: 1000,
      invitationsPerUser: 1000,
      invitationsPerAddress: 1000,
      resetsPerAccount: 1000,
      confirmationsPerAccount: 1000,
      ...limitSettings,
    },
    rateLimitNamespace: `test-${randomUUID()}:`,
  });
  return {
    app,
    deps,
    database,
    config,
    drainMail: () => deps.mail.drain(),
    close: async () => {
      deps.mail.stop();
      mailer.close();
      await smtp.close();
      await database.pool.end();
    },
  };
}

/** Marks an account's address confirmed, as opening the mailed link does (tests of other things start here). */
export async function confirmAddress(t: TestApp, userId: string) {
  await t.database.db.update(users).set({ emailConfirmedAt: new Date() }).where(eq(users.id, userId));
}

export function uniqueEmail(prefix = 'user') {
  return `${prefix}-${randomUUID().slice(0, 8)}@example.test`;
}

/** A browser-like client: keeps cookies and sends our Origin on every request. */
export function client(t: TestApp) {
  const agent = request.agent(t.app);
  const withOrigin = <T extends { set: (k: string, v: string) => T }>(r: T) => r.set('Origin', ORIGIN);
  return {
    agent,
    get: (url: string) => agent.get(url),
    post: (url: string, body?: object) => withOrigin(agent.post(url)).send(body),
    put: (url: string, body?: object) => withOrigin(agent.put(url)).send(body),
    patch: (url: string, body?: object) => withOrigin(agent.patch(url)).send(body),
    delete: (url: string) => withOrigin(agent.delete(url)),
  };
}
export type Client = ReturnType<typeof client>;

export const PASSWORD = 'correct horse battery';

/**
 * Signs a new account up and returns the signed-in client with its user and personal team. The
 * address is confirmed (as if the mailed link was opened) unless `confirmed: false`; the
 * confirmation itself is tested in auth.test.ts.
 */
export async function signedUp(t: TestApp, prefix = 'user', { confirmed = true }: { confirmed?: boolean } = {}) {
  const c = client(t);
  const email = uniqueEmail(prefix);
  const res = await c.post('/api/auth/sign-up', { email, password: PASSWORD, name: `${prefix} ${email.slice(-14, -13)}` });
  if (res.status !== 201) throw new Error(`sign-up failed: ${res.status} ${JSON.stringify(res.body)}`);
  if (confirmed) await confirmAddress(t, res.body.user.id);
  return { c, email, user: res.body.user as { id: string }, personalTeamId: res.body.teams[0].id as string };
}

/**
 * The newest message the fake SMTP server stored for `to` (the newest whose text holds
 * `containing`, when given), once queued mail has gone out. Another test app's mail worker may
 * deliver an earlier message to the same address after a later one, so tests that want one kind
 * of message say which.
 */
export async function latestMailTo(t: TestApp, to: string, containing?: string) {
  await t.drainMail();
  const rows = await t.database.db.select().from(outbox).where(eq(outbox.to, to)).orderBy(desc(outbox.receivedAt));
  const row = containing === undefined ? rows[0] : rows.find((r) => r.text.includes(containing));
  if (!row) throw new Error(`no mail to ${to}${containing === undefined ? '' : ` with ${containing}`} in the outbox`);
  return row;
}

/** The link with `pathPrefix` in the newest message to `to` that has one (other mail may have come after it). */
export async function latestLinkTo(t: TestApp, to: string, pathPrefix: string): Promise<string> {
  return linkIn((await latestMailTo(t, to, pathPrefix)).text, pathPrefix);
}

export function linkIn(text: string, pathPrefix: string): string {
  const m = text.match(new RegExp(`https?://[^\\s]+${pathPrefix.replace(/[?/]/g, (c) => `\\${c}`)}[^\\s]+`));
  if (!m) throw new Error(`no ${pathPrefix} link in: ${text}`);
  return m[0];
}

export function expectErrorShape(body: unknown) {
  const b = body as { error?: { code?: unknown; message?: unknown } };
  if (!b?.error || typeof b.error.code !== 'string' || typeof b.error.message !== 'string') {
    throw new Error(`not the error shape: ${JSON.stringify(body)}`);
  }
}

/** The demo study document (data/demo/hillclimb-study.json), as a client would send it. */
export const demoDocument = JSON.parse(readFileSync(path.resolve(import.meta.dirname, '..', '..', 'data', 'demo', 'hillclimb-study.json'), 'utf8'));

/** A new account with a new (not personal) team it owns. */
export async function teamOf(t: TestApp, prefix: string) {
  const owner = await signedUp(t, prefix);
  const teamId = (await owner.c.post('/api/teams', { name: `${prefix} team` })).body.team.id as string;
  return { owner, teamId };
}

/** A new account that joins the team with `role` as an invitee does: through the mailed link. */
export async function join(t: TestApp, owner: Client, teamId: string, role: 'owner' | 'editor' | 'viewer', prefix: string) {
  const member = await signedUp(t, prefix);
  await owner.post(`/api/teams/${teamId}/invitations`, { email: member.email, role });
  const token = (await latestLinkTo(t, member.email, '/invitations/')).split('/invitations/')[1];
  expect((await member.c.post(`/api/invitations/${token}/accept`, {})).status).toBe(200);
  return member;
}

/** An owner, their new team and one study in it made from the demo document. */
export async function teamWithStudy(t: TestApp) {
  const owner = await signedUp(t, 'study-owner');
  const teamId = (await owner.c.post('/api/teams', { name: 'Study team' })).body.team.id as string;
  const created = await owner.c.post(`/api/teams/${teamId}/studies`, { title: 'Hill-climb plan', document: demoDocument });
  if (created.status !== 201) throw new Error(JSON.stringify(created.body));
  return { owner, teamId, study: created.body.study as { id: string; revision: number; document: typeof demoDocument } };
}

/** The `token` query parameter of a mailed link. */
export const tokenOf = (link: string) => new URL(link).searchParams.get('token')!;

/** The session cookie an answer sets (`name=value`), if it sets one that is not a blank. */
export const sessionCookie = (res: request.Response) =>
  (res.headers['set-cookie'] as unknown as string[] | undefined)
    ?.find((c) => c.startsWith('spoolbook_session=') && !c.startsWith('spoolbook_session=;'))
    ?.split(';')[0];

/** A client signed in as the seeded site admin. */
export async function adminClient(t: TestApp) {
  const admin = client(t);
  const res = await admin.post('/api/auth/sign-in', { email: ADMIN_USER.email, password: ADMIN_USER.password });
  if (res.status !== 200) throw new Error('the seeded admin could not sign in');
  return admin;
}
