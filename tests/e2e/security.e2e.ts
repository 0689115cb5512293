import { randomUUID } from 'node:crypto';
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { generate } from 'otplib';
import type { Browser, Locator, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  ADMIN_USER,
  baseUrl,
  closeTestDatabase,
  DEMO_USER,
  launchBrowser,
  linkFromOutbox,
  screenshot,
  screenshotDir,
  signIn,
  submitSignIn,
  watchForPageErrors,
} from './browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await closeTestDatabase();
});

const PASSWORD = 'a long enough password';

async function newPage(): Promise<{ page: Page; errors: string[] }> {
  const context = await browser.newContext({ viewport: { width: 1280, height: 860 } });
  const page = await context.newPage();
  return { page, errors: watchForPageErrors(page) };
}

async function signUpThroughForm(page: Page, email: string) {
  await page.goto(`${baseUrl()}/sign-up`);
  const form = page.getByRole('form', { name: 'Create account' });
  await form.getByLabel('Your name').fill('Sasha Secure');
  await form.getByLabel('E-mail').fill(email);
  // The strength hint follows what is typed: a common password is called out at once.
  await form.getByLabel('Password').fill('password');
  await page.getByTestId('password-strength').filter({ hasText: 'Very easy to guess' }).waitFor();
  await screenshot(page, 'sign-up-weak-password');
  await form.getByLabel('Password').fill(PASSWORD);
  await page
    .getByTestId('password-strength')
    .filter({ hasText: /strong/i })
    .waitFor();
  await form.getByRole('button', { name: 'Create account' }).click();
  await page.getByRole('link', { name: 'Team' }).first().waitFor();
}

/** The page (or one part of it) at 1280 wide, then as on a phone (390 × 844), then back. */
async function screenshots(page: Page, name: string, part?: Locator) {
  const shoot = (file: string) => (part ? part.screenshot({ path: path.join(screenshotDir, `${file}.png`) }) : screenshot(page, file));
  mkdirSync(screenshotDir, { recursive: true });
  await shoot(name);
  const size = page.viewportSize()!;
  await page.setViewportSize({ width: 390, height: 844 });
  await shoot(`${name}-phone`);
  await page.setViewportSize(size);
}

/** Turns the second factor on under Account → Second factor, as a user does; returns the key the app holds. */
async function turnOnSecondFactor(page: Page, shots = false): Promise<string> {
  const setup = page.getByRole('form', { name: 'Set up a second factor' });
  await setup.getByLabel('Your password').fill(PASSWORD);
  await setup.getByRole('button', { name: 'Set up' }).click();
  const key = (await page.getByTestId('totp-key').textContent())!.trim();
  await page.getByAltText('A code to scan with an authenticator app').waitFor();
  if (shots) await screenshot(page, 'two-factor-setup');
  const turnOn = page.getByRole('form', { name: 'Turn on the second factor' });
  await turnOn.getByLabel('Code from the app').fill(await generate({ secret: key }));
  await turnOn.getByRole('button', { name: 'Turn on' }).click();
  await page.getByText('Keep these recovery codes').waitFor();
  expect(await page.getByRole('list', { name: 'Recovery codes' }).getByRole('listitem').count()).toBe(10);
  if (shots) await screenshot(page, 'two-factor-recovery-codes');
  await page.getByRole('button', { name: 'I have kept them' }).click();
  await page.getByText('The second factor is on').waitFor();
  return key;
}

/** Opens the confirmation link the sign-up mailed (the address must be confirmed to make or join teams). */
async function confirmAddress(page: Page, email: string) {
  const link = await linkFromOutbox(email, '/confirm-email?token=');
  await page.goto(link.replace(/^https?:\/\/[^/]+/, baseUrl()));
  await page.getByText('Address confirmed').waitFor();
}

/** State-changing API calls need the app's own Origin (docs/api.md). */
const origin = () => ({ Origin: baseUrl() });

describe('security screens: sessions, second factor', () => {
  it('lists the sessions of an account and ends another one', async () => {
    const email = `sessions-${randomUUID().slice(0, 8)}@example.test`;
    const { page, errors } = await newPage();
    await signUpThroughForm(page, email);
    const { page: other } = await newPage();
    await submitSignIn(other, { email, password: PASSWORD });
    await other.waitForURL((url) => !url.pathname.startsWith('/sign-in'));

    await page.goto(`${baseUrl()}/settings/sessions`);
    await page.getByRole('heading', { name: 'Sessions', level: 1 }).waitFor();
    await page.getByText('this one').waitFor();
    expect(await page.getByRole('button', { name: /^End the session in/ }).count()).toBe(1);
    await screenshot(page, 'sessions');
    await page.getByRole('button', { name: /^End the session in/ }).click();
    await page.getByRole('button', { name: /^End the session in/ }).waitFor({ state: 'detached' });
    // The other browser is signed out.
    await other.goto(`${baseUrl()}/settings`);
    await other.waitForURL((url) => url.pathname.startsWith('/sign-in'));
    expect(errors).toEqual([]);
  });

  it('sets up a second factor, keeps the recovery codes, and then asks for a code at sign-in', async () => {
    const email = `totp-${randomUUID().slice(0, 8)}@example.test`;
    const { page, errors } = await newPage();
    await signUpThroughForm(page, email);
    await page.goto(`${baseUrl()}/settings`);
    const key = await turnOnSecondFactor(page, true);

    const { page: later, errors: laterErrors } = await newPage();
    await submitSignIn(later, { email, password: PASSWORD });
    const second = later.getByRole('form', { name: 'Second factor' });
    await second.waitFor();
    await screenshot(later, 'sign-in-second-factor');
    await second.getByLabel('Code').fill(await generate({ secret: key, epoch: Math.floor(Date.now() / 1000) + 30 }));
    await second.getByRole('button', { name: 'Confirm' }).click();
    await later.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
    expect(errors).toEqual([]);
    expect(laterErrors).toEqual([]);
  });
});

describe("security screens: a team's second-factor rule, share links, the admin's Users page", () => {
  it('an owner asks every member for a second factor; a member without one is led to set it up and gets back in', async () => {
    const stamp = randomUUID().slice(0, 8);
    const ownerEmail = `rule-owner-${stamp}@example.test`;
    const memberEmail = `rule-member-${stamp}@example.test`;
    const teamName = `Dyno cell ${stamp}`;

    // The owner: a confirmed address, a second factor, a team, an invitation.
    const { page: owner, errors: ownerErrors } = await newPage();
    await signUpThroughForm(owner, ownerEmail);
    await confirmAddress(owner, ownerEmail);
    await owner.goto(`${baseUrl()}/settings`);
    await turnOnSecondFactor(owner);
    await owner.goto(`${baseUrl()}/teams`);
    const create = owner.getByRole('form', { name: 'Create a team' });
    await create.getByLabel('Team name').fill(teamName);
    await create.getByRole('button', { name: 'Create team' }).click();
    await owner.getByRole('heading', { name: teamName, level: 1 }).waitFor();
    const teamUrl = owner.url();
    const invite = owner.getByRole('form', { name: 'Invite someone' });
    await invite.getByLabel('E-mail to invite').fill(memberEmail);
    await invite.getByRole('button', { name: 'Send invitation' }).click();
    await owner.getByText(`Invitation sent to ${memberEmail}`).waitFor();

    // The member joins from the mailed link, with a password only.
    const { page: member, errors: memberErrors } = await newPage();
    await member.goto((await linkFromOutbox(memberEmail, '/invitations/')).replace(/^https?:\/\/[^/]+/, baseUrl()));
    const join = member.getByRole('form', { name: 'Create account' });
    await join.getByLabel('Your name').fill('Morgan Member');
    await join.getByLabel('Password').fill(PASSWORD);
    await join.getByRole('button', { name: 'Create account' }).click();
    await member.getByRole('button', { name: `Join ${teamName}` }).click();
    await member.getByRole('heading', { name: teamName, level: 1 }).waitFor();
    await member.getByTestId('team-two-factor-state').filter({ hasText: 'does not ask its members' }).waitFor();

    // The owner turns the rule on.
    await owner.goto(teamUrl);
    const rule = owner.getByRole('switch', { name: 'Members must use a second factor' });
    expect(await rule.getAttribute('aria-checked')).toBe('false');
    await rule.click();
    await owner.getByRole('switch', { name: 'Members must use a second factor', checked: true }).waitFor();
    await owner.reload();
    await owner.getByRole('switch', { name: 'Members must use a second factor', checked: true }).waitFor();
    await screenshots(owner, 'team-second-factor-rule');

    // The member is told why, and where to go: on the team page, and above the studies.
    await member.goto(teamUrl);
    await member.getByTestId('second-factor-needed').getByText(`${teamName} asks its members to use a second factor`).waitFor();
    expect(await member.getByText(/not found|does not exist/i).count()).toBe(0);
    await member.getByRole('button', { name: 'Leave team' }).waitFor();
    await screenshots(member, 'team-second-factor-needed');
    await member.goto(`${teamUrl}/studies`);
    const banner = member.getByTestId('second-factor-banner');
    await banner.getByText(`${teamName} asks its members to use a second factor`).waitFor();
    await screenshots(member, 'team-second-factor-banner');
    await banner.getByRole('link', { name: 'Set up a second factor' }).click();
    await member.waitForURL((url) => url.pathname === '/settings' && url.hash === '#second-factor');
    await member.locator('#second-factor').getByText(`${teamName} asks its members to use a second factor`).waitFor();
    await turnOnSecondFactor(member);

    // With it on, the team opens again and says which way its rule is set.
    await member.goto(teamUrl);
    await member.getByRole('table', { name: 'Members' }).waitFor();
    await member.getByTestId('team-two-factor-state').filter({ hasText: 'This team asks every member to use a second factor' }).waitFor();
    expect(await member.getByTestId('second-factor-banner').count()).toBe(0);
    expect(ownerErrors).toEqual([]);
    expect(memberErrors).toEqual([]);
  });

  it('makes share links for 30 days, for other days and for never, and an owner keeps one for when its maker leaves', async () => {
    const base = baseUrl();
    const { page, errors } = await newPage();
    page.setDefaultTimeout(60_000);
    await signIn(page, DEMO_USER);
    const me = (await (await page.request.get(`${base}/api/auth/me`)).json()) as { teams: { id: string; name: string }[] };
    const teamId = me.teams.find((t) => t.name === DEMO_USER.team)!.id;
    // A study of this test's own, from the demo.
    const created = await page.request.post(`${base}/api/teams/${teamId}/studies`, {
      data: { title: `Shared ${randomUUID().slice(0, 8)}` },
      headers: origin(),
    });
    expect(created.status()).toBe(201);
    const studyId = ((await created.json()) as { study: { id: string } }).study.id;

    await page.goto(`${base}/teams/${teamId}/studies/${studyId}`);
    await page.getByRole('button', { name: 'Share', exact: true }).click();
    const panel = page.getByTestId('share-panel');
    const rows = panel.getByTestId('share-link');
    const make = panel.getByRole('button', { name: 'Make a share link' });

    // Empty days: 30 days from now.
    await make.click();
    await panel.getByTestId('share-url').waitFor();
    await rows.nth(0).waitFor();
    // Then 7 days, and one that never expires.
    await panel.getByLabel('Expires after (days)').fill('7');
    await make.click();
    await expect.poll(() => rows.count()).toBe(2);
    await panel.getByLabel('Never expires').check();
    await make.click();
    await expect.poll(() => rows.count()).toBe(3);
    await rows.nth(0).getByText('Does not expire').waitFor();

    const listed = async () =>
      (
        (await (await page.request.get(`${base}/api/teams/${teamId}/studies/${studyId}/share-links`)).json()) as {
          shareLinks: { id: string; createdAt: string; expiresAt: string | null; kept: boolean }[];
        }
      ).shareLinks;
    const [never, week, month] = await listed();
    const daysAfter = (link: { createdAt: string; expiresAt: string | null }) =>
      Math.round((Date.parse(link.expiresAt!) - Date.parse(link.createdAt)) / 86_400_000);
    expect(never.expiresAt).toBeNull();
    expect(daysAfter(week)).toBe(7); // typed above
    expect(daysAfter(month)).toBe(30); // the default of docs/api.md

    // The owner keeps the 7-day link for when its maker leaves; the list says so after a reload.
    const keep = rows.nth(1).getByRole('switch', { name: 'Keep when its maker leaves' });
    expect(await keep.getAttribute('aria-checked')).toBe('false');
    await keep.click();
    await rows.nth(1).getByText(`Goes on working if ${DEMO_USER.name} leaves the team.`).waitFor();
    await screenshots(page, 'share-links', page.locator('#panel-share'));
    expect((await listed()).map((l) => l.kept)).toEqual([false, true, false]);
    await page.reload();
    await page.getByRole('button', { name: 'Share', exact: true }).click();
    expect(await page.getByTestId('share-link').nth(1).getByRole('switch', { name: 'Keep when its maker leaves' }).getAttribute('aria-checked')).toBe('true');
    expect(errors).toEqual([]);
  });

  it('lets a site admin find a user and end all their sessions, after a confirm', async () => {
    const email = `ended-${randomUUID().slice(0, 8)}@example.test`;
    const { page: user } = await newPage();
    await signUpThroughForm(user, email);

    const { page: admin, errors } = await newPage();
    await signIn(admin, ADMIN_USER);
    await admin.goto(`${baseUrl()}/admin`);
    await admin.getByRole('navigation', { name: 'Site admin' }).getByRole('link', { name: 'Users' }).click();
    await admin.getByRole('heading', { name: 'Users', level: 1 }).waitFor();
    await admin.getByLabel('Search by name or e-mail').fill(email);
    await admin.getByRole('table', { name: `1 user matching “${email}”` }).waitFor();
    const row = admin.getByRole('row').filter({ hasText: email });
    // Signed up a moment ago: address not yet confirmed, no second factor, one session.
    await row.getByText('Not confirmed', { exact: true }).waitFor();
    // Cells after the name: address, second factor, sessions, last used.
    expect(await row.getByRole('cell').nth(2).textContent()).toBe('1');
    await screenshots(admin, 'admin-users');

    await row.getByRole('button', { name: 'End all sessions of Sasha Secure' }).click();
    const dialog = admin.getByRole('dialog', { name: 'End every session of Sasha Secure?' });
    await dialog.getByText(`Sasha Secure (${email}) is signed out at once in every browser: 1 session.`).waitFor();
    await screenshot(admin, 'admin-users-confirm');
    await dialog.getByRole('button', { name: 'End all sessions' }).click();
    await admin.getByText('Sasha Secure is signed out everywhere').waitFor();
    await expect.poll(() => row.getByRole('cell').nth(2).textContent()).toBe('0');
    expect(await row.getByRole('button', { name: 'End all sessions of Sasha Secure' }).isDisabled()).toBe(true);

    // The user's browser is signed out.
    await user.goto(`${baseUrl()}/settings`);
    await user.waitForURL((url) => url.pathname.startsWith('/sign-in'));
    expect(errors).toEqual([]);
  });
});
