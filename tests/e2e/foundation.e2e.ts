import { randomUUID } from 'node:crypto';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ADMIN_USER, baseUrl, closeTestDatabase, launchBrowser, linkFromOutbox, screenshot, signIn, watchForPageErrors } from './browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await closeTestDatabase();
});

async function newPage(): Promise<{ page: Page; errors: string[] }> {
  const context = await browser.newContext({ viewport: { width: 1280, height: 860 } });
  const page = await context.newPage();
  return { page, errors: watchForPageErrors(page) };
}

describe('foundation: sign-up, teams, invitations', () => {
  it('a new user signs up, creates a team and invites a viewer, who joins from the e-mailed link and sees no edit controls', async () => {
    const stamp = randomUUID().slice(0, 8);
    const ownerEmail = `owner-${stamp}@example.test`;
    const viewerEmail = `viewer-${stamp}@example.test`;
    const teamName = `Workshop ${stamp}`;

    const { page: owner, errors: ownerErrors } = await newPage();
    await owner.goto(`${baseUrl()}/sign-up`);
    await screenshot(owner, 'sign-up');
    const signUp = owner.getByRole('form', { name: 'Create account' });
    await signUp.getByLabel('Your name').fill('Olive Owner');
    await signUp.getByLabel('E-mail').fill(ownerEmail);
    await signUp.getByLabel('Password').fill('a long enough password');
    await signUp.getByRole('button', { name: 'Create account' }).click();
    await owner.getByRole('link', { name: 'Team' }).first().waitFor();

    // Creating a team waits for the address: the page says so, and the mailed link confirms it.
    await owner.goto(`${baseUrl()}/teams`);
    await owner.getByText('Confirm your e-mail address').waitFor();
    await screenshot(owner, 'sign-up-unconfirmed');
    const confirmLink = await linkFromOutbox(ownerEmail, '/confirm-email?token=');
    await owner.goto(confirmLink.replace(/^https?:\/\/[^/]+/, baseUrl()));
    await owner.getByText('Address confirmed').waitFor();
    await screenshot(owner, 'sign-up-confirmed');

    await owner.goto(`${baseUrl()}/teams`);
    await owner.getByRole('heading', { name: 'Teams', level: 1 }).waitFor();
    const create = owner.getByRole('form', { name: 'Create a team' });
    await create.getByLabel('Team name').fill(teamName);
    await create.getByRole('button', { name: 'Create team' }).click();
    await owner.getByRole('heading', { name: teamName, level: 1 }).waitFor();

    const invite = owner.getByRole('form', { name: 'Invite someone' });
    await invite.getByLabel('E-mail to invite').fill(viewerEmail);
    await invite.getByLabel('Role').selectOption('viewer');
    await invite.getByRole('button', { name: 'Send invitation' }).click();
    await owner.getByText(`Invitation sent to ${viewerEmail}`).waitFor();
    await screenshot(owner, 'team-owner');

    const link = await linkFromOutbox(viewerEmail, '/invitations/');
    expect(link.startsWith('http')).toBe(true);

    const { page: viewer, errors: viewerErrors } = await newPage();
    await viewer.goto(link.replace(/^https?:\/\/[^/]+/, baseUrl()));
    await viewer.getByRole('heading', { name: `Join ${teamName}` }).waitFor();
    await screenshot(viewer, 'invitation');
    const join = viewer.getByRole('form', { name: 'Create account' });
    expect(await join.getByLabel('E-mail').inputValue()).toBe(viewerEmail);
    await join.getByLabel('Your name').fill('Vic Viewer');
    await join.getByLabel('Password').fill('another long password');
    await join.getByRole('button', { name: 'Create account' }).click();
    await viewer.getByRole('button', { name: `Join ${teamName}` }).click();
    await viewer.getByRole('heading', { name: teamName, level: 1 }).waitFor();
    await viewer.getByText('Olive Owner').waitFor();
    await screenshot(viewer, 'team-viewer');

    // A viewer sees the team and its members, and no control that changes anything.
    expect(await viewer.getByRole('form', { name: 'Invite someone' }).count()).toBe(0);
    expect(await viewer.getByRole('form', { name: 'Rename team' }).count()).toBe(0);
    expect(await viewer.getByRole('button', { name: /^Remove / }).count()).toBe(0);
    expect(await viewer.getByRole('button', { name: /^Save role of / }).count()).toBe(0);
    expect(await viewer.getByRole('button', { name: /delete/i }).count()).toBe(0);

    // The owner now sees the viewer as a member.
    await owner.reload();
    await owner.getByRole('rowheader', { name: 'Vic Viewer' }).waitFor();

    expect(ownerErrors).toEqual([]);
    expect(viewerErrors).toEqual([]);
  });

  it('the main pages render for the demo user and the site admin', async () => {
    const { page, errors } = await newPage();
    await page.goto(`${baseUrl()}/sign-in`);
    await screenshot(page, 'sign-in');
    await signIn(page, ADMIN_USER);
    await page.getByRole('link', { name: 'Team' }).first().waitFor();
    for (const [path, name] of [
      ['/teams', 'teams'],
      ['/settings', 'settings'],
      ['/admin/teams', 'admin-teams'],
      ['/admin/outbox', 'admin-outbox'],
    ]) {
      await page.goto(`${baseUrl()}${path}`);
      await page.getByRole('heading', { level: 1 }).first().waitFor();
      await screenshot(page, name);
    }
    expect(errors).toEqual([]);
  });
});
