import { randomUUID } from 'node:crypto';
import { generate } from 'otplib';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { baseUrl, closeTestDatabase, launchBrowser, screenshot, watchForPageErrors } from './browser';

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
  await page.getByTestId('password-strength').filter({ hasText: /strong/i }).waitFor();
  await form.getByRole('button', { name: 'Create account' }).click();
  await page.getByRole('link', { name: 'Team' }).first().waitFor();
}

async function signInThroughForm(page: Page, email: string) {
  await page.goto(`${baseUrl()}/sign-in`);
  const form = page.getByRole('form', { name: 'Sign in' });
  await form.getByLabel('E-mail').fill(email);
  await form.getByLabel('Password', { exact: true }).fill(PASSWORD);
  await form.getByRole('button', { name: 'Sign in' }).click();
}

describe('security screens: sessions, second factor', () => {
  it('lists the sessions of an account and ends another one', async () => {
    const email = `sessions-${randomUUID().slice(0, 8)}@example.test`;
    const { page, errors } = await newPage();
    await signUpThroughForm(page, email);
    const { page: other } = await newPage();
    await signInThroughForm(other, email);
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
    const setup = page.getByRole('form', { name: 'Set up a second factor' });
    await setup.getByLabel('Your password').fill(PASSWORD);
    await setup.getByRole('button', { name: 'Set up' }).click();
    const key = (await page.getByTestId('totp-key').textContent())!.trim();
    await page.getByAltText('A code to scan with an authenticator app').waitFor();
    await screenshot(page, 'two-factor-setup');
    const turnOn = page.getByRole('form', { name: 'Turn on the second factor' });
    await turnOn.getByLabel('Code from the app').fill(await generate({ secret: key }));
    await turnOn.getByRole('button', { name: 'Turn on' }).click();
    await page.getByText('Keep these recovery codes').waitFor();
    expect(await page.getByRole('list', { name: 'Recovery codes' }).getByRole('listitem').count()).toBe(10);
    await screenshot(page, 'two-factor-recovery-codes');
    await page.getByRole('button', { name: 'I have kept them' }).click();
    await page.getByText('The second factor is on').waitFor();

    const { page: later, errors: laterErrors } = await newPage();
    await signInThroughForm(later, email);
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
