/** Accounts in Chromium, as a person uses them: elements are found by their labels and roles. */
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BASE_URL, launchBrowser, saveScreenshot } from '../support/browser.ts';
import { linkIn, uniqueEmail, waitForMail } from '../support/outbox.ts';
import { newShopUser } from '../support/sessions.ts';
import { closeDb } from '../support/test-db.ts';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await closeDb();
});

async function signIn(page: Page, email: string, password: string): Promise<void> {
  await page.goto(`${BASE_URL}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password', { exact: true }).fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForLoadState('load');
}

async function choosePassword(page: Page, password: string, name?: string): Promise<void> {
  if (name !== undefined) await page.getByLabel('Your name').fill(name);
  await page.getByLabel(/^(New password|Password)$/).fill(password);
  await page.getByLabel(/^Repeat the/).fill(password);
}

describe('accounts in Chromium (built server)', () => {
  const ownerEmail = uniqueEmail('owner');
  const builderEmail = uniqueEmail('builder');

  it('creates a shop, invites a Builder who joins from the e-mailed link, signs in and out', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();

    await page.goto(`${BASE_URL}/create-shop`);
    await page.getByLabel('Shop name').fill('Alder & Pine Lutherie');
    await page.getByLabel('Your e-mail').fill(ownerEmail);
    await page.getByRole('button', { name: 'Create shop' }).click();
    await expect(page.getByRole('status').textContent()).resolves.toContain('Check your e-mail');

    // Fixed subject; the shop name someone typed is quoted in the body only.
    const welcome = await waitForMail(ownerEmail, /^Finish setting up your Kerfline shop$/);
    expect(welcome.text).toContain('"Alder & Pine Lutherie"');
    await page.goto(linkIn(welcome, '/invitations/').url);
    await expect(page.getByRole('heading', { level: 1 }).textContent()).resolves.toBe('Join Alder & Pine Lutherie');
    expect(await page.getByText('Owner', { exact: true }).count()).toBe(1);
    await choosePassword(page, 'owner-password-1', 'Wen Alder');
    await page.getByRole('button', { name: 'Join the shop' }).click();
    await expect(page.getByRole('status').textContent()).resolves.toContain('Your account is ready');

    await signIn(page, ownerEmail, 'owner-password-1');
    expect(new URL(page.url()).pathname).toBe('/boards');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Members' }).click();
    await page.getByLabel('E-mail of the person to invite').fill(builderEmail);
    await page.getByLabel('Role', { exact: true }).selectOption('builder');
    await page.getByRole('button', { name: 'Send invitation' }).click();
    await expect(page.getByRole('status').textContent()).resolves.toBe('Invitation sent.');
    expect(await page.getByRole('cell', { name: builderEmail, exact: true }).count()).toBe(1);
    await saveScreenshot(page, 'members-after-invite');

    // The Builder opens the invitation from the captured e-mail, in another browser.
    const invitation = await waitForMail(builderEmail, /^You are invited to a shop on Kerfline$/);
    expect(invitation.text).toContain('Wen Alder invites you to join Alder & Pine Lutherie');
    const builderContext = await browser.newContext();
    const builderPage = await builderContext.newPage();
    await builderPage.goto(linkIn(invitation, '/invitations/').url);
    expect(await builderPage.getByText('Builder', { exact: true }).count()).toBe(1);
    await choosePassword(builderPage, 'short', 'Ossie Kerf');
    await builderPage.getByRole('button', { name: 'Join the shop' }).click();
    await expect(builderPage.locator('#f-password-error').textContent()).resolves.toBe('Use at least 10 characters');
    await choosePassword(builderPage, 'builder-password-1');
    await builderPage.getByRole('button', { name: 'Join the shop' }).click();
    await expect(builderPage.getByRole('status').textContent()).resolves.toContain('Your account is ready');

    await signIn(builderPage, builderEmail, 'builder-password-1');
    expect(new URL(builderPage.url()).pathname).toBe('/boards');
    await expect(builderPage.getByRole('link', { name: 'Ossie Kerf (builder)' }).count()).resolves.toBe(1);
    expect(await builderPage.getByRole('link', { name: 'Members' }).count()).toBe(0);
    await builderPage.getByRole('button', { name: 'Sign out' }).click();
    await builderPage.waitForLoadState('load');
    await expect(builderPage.getByRole('status').textContent()).resolves.toContain('signed out');
    const boards = await builderPage.goto(`${BASE_URL}/boards`);
    expect(new URL(builderPage.url()).pathname).toBe('/sign-in');
    expect(boards?.status()).toBe(200);

    // The invitation link worked once.
    const again = await builderPage.goto(linkIn(invitation, '/invitations/').url);
    expect(again?.status()).toBe(410);
    await context.close();
    await builderContext.close();
  });

  it('resets a forgotten password end to end from the e-mailed link', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    await page.goto(`${BASE_URL}/sign-in`);
    await page.getByRole('link', { name: 'Forgot your password?' }).click();
    await page.getByLabel('E-mail').fill(builderEmail);
    await page.getByRole('button', { name: 'Send the link' }).click();
    await expect(page.getByRole('status').textContent()).resolves.toContain('Check your e-mail');

    const mail = await waitForMail(builderEmail, /Reset your Kerfline password/);
    await page.goto(linkIn(mail, '/reset-password/').url);
    await choosePassword(page, 'renewed-password-7');
    await page.getByRole('button', { name: 'Set the new password' }).click();
    await expect(page.getByRole('status').textContent()).resolves.toContain('Your password is changed');

    await signIn(page, builderEmail, 'builder-password-1');
    await expect(page.getByRole('alert').textContent()).resolves.toBe('The e-mail or the password is wrong.');
    await signIn(page, builderEmail, 'renewed-password-7');
    expect(new URL(page.url()).pathname).toBe('/boards');
    await context.close();
  });

  it('shows captured e-mails on the Outbox page with clickable links', async () => {
    const user = await newShopUser('client');
    const asked = await fetch(`${BASE_URL}/forgot-password`, {
      method: 'POST',
      headers: { origin: BASE_URL, 'content-type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({ email: user.email }).toString(),
    });
    expect(asked.status).toBe(200);
    await waitForMail(user.email, /Reset your Kerfline password/);

    const page = await browser.newPage();
    await page.goto(`${BASE_URL}/outbox`);
    const article = page.getByRole('article', { name: 'Reset your Kerfline password' }).filter({ hasText: user.email });
    await article.getByRole('link').first().click();
    await page.waitForLoadState('load');
    expect(new URL(page.url()).pathname).toMatch(/^\/reset-password\//);
    await expect(page.getByRole('heading', { level: 1 }).textContent()).resolves.toBe('Choose a new password');
  });
});
