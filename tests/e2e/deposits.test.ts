/**
 * The client's deposit path in Chromium on the built server, with the run's fake payment service
 * on loopback: approve, the fake's pay page, back to the proof page; "deposit paid" only once the
 * fake's signed webhook reached the app.
 */
import type { Page } from 'playwright-core';
import { beforeAll, describe, expect, it } from 'vitest';
import { SESSION_COOKIE } from '~/lib/auth/index.server.ts';
import { createProof } from '~/lib/proofs/proofs.server.ts';
import { BASE_URL, saveScreenshot } from '../support/browser.ts';
import { browserSuite } from '../support/browser-suite.ts';
import { startBuiltServer } from '../support/built-server.ts';
import { ensureDesign } from '../support/designs.ts';
import { fakeOrigin, fakeSessions, holdWebhooks, releaseWebhooks, TEST_CARDS } from '../support/fake-payments.ts';

const suite = browserSuite();
let boardId: number;

beforeAll(async () => {
  boardId = await ensureDesign(suite.builder.shopId, suite.builder.id, 'Seven-string', 'seven-string-fan');
});

let counter = 0;

/** A proof of the seven-string with a €500.00 deposit; the path of its link on the test server. */
async function proofPath(): Promise<{ path: string; proofId: number }> {
  const email = `deposit-e2e-${Date.now()}-${++counter}@wrenfield.example`;
  const sent = await createProof(suite.builder, boardId, {
    clientName: 'Ines Calloway',
    clientEmail: email,
    message: '',
    expiresInDays: 30,
    deposit: { amountMinor: 50_000, currency: 'EUR', description: 'Deposit to start the build' },
  }, new Date());
  if (!sent) throw new Error('no proof');
  return { path: new URL(sent.link).pathname, proofId: sent.proof.id };
}

async function approveOn(page: Page): Promise<void> {
  const form = page.getByRole('form', { name: 'Approve' });
  await form.getByLabel('Your name').fill('Ines Calloway');
  await form.getByRole('checkbox').check();
  await form.getByRole('button', { name: 'Approve' }).click();
}

async function onPayPage(page: Page): Promise<void> {
  await page.waitForURL((url) => url.origin === fakeOrigin());
  await page.getByRole('heading', { name: 'Pay €500.00' }).waitFor();
}

async function payOn(page: Page): Promise<void> {
  await page.getByLabel('Card number').fill(TEST_CARDS.pays);
  await page.getByRole('button', { name: 'Pay' }).click();
}

const depositState = (page: Page) => page.locator('[data-deposit-state]').getAttribute('data-deposit-state');

/** Waits until the page's deposit box says paid, and returns its text. */
async function paidBox(page: Page): Promise<string> {
  const box = page.locator('[data-deposit-state="paid"]').first();
  await box.waitFor();
  return box.innerText();
}

describe('deposit on approval, in Chromium', () => {
  it('approve, pay on the fake\'s page, back to the proof page: paid (the webhook came before the browser)', async () => {
    const { path } = await proofPath();
    const page = await suite.browser.newPage();
    await page.goto(`${BASE_URL}${path}`);
    await page.getByRole('heading', { name: 'Deposit: €500.00' }).waitFor();
    await approveOn(page);
    await onPayPage(page);
    await expect(page.getByText(TEST_CARDS.declined).count()).resolves.toBe(1);
    await payOn(page);
    await page.waitForURL(`${BASE_URL}${path}?deposit=returned`);
    expect(await paidBox(page)).toMatch(/Deposit paid: €500\.00 received on \d{1,2} [A-Z][a-z]+ \d{4}, \d\d:\d\d \([A-Za-z_/]+\)/);
    await page.getByText(/Approved by Ines Calloway/).waitFor();
    await saveScreenshot(page, 'deposit-paid');

    // The builder sees it on the board's proofs.
    const context = await suite.browser.newContext();
    await context.addCookies([{ name: SESSION_COOKIE, value: suite.builder.token, url: BASE_URL }]);
    const panel = await context.newPage();
    await panel.goto(`${BASE_URL}/boards/${boardId}/proofs`);
    expect(await paidBox(panel)).toContain('deposit paid: €500.00');
    await context.close();
    await page.close();
  });

  it('back before the webhook: not paid yet, then paid once the webhook arrives', async () => {
    const { path } = await proofPath();
    const page = await suite.browser.newPage();
    await holdWebhooks();
    try {
      await page.goto(`${BASE_URL}${path}`);
      await approveOn(page);
      await onPayPage(page);
      await payOn(page);
      await page.waitForURL(`${BASE_URL}${path}?deposit=returned`);
      await page.getByText(/has not yet confirmed your payment/).waitFor();
      expect(await depositState(page)).toBe('awaiting_payment');
      expect(await page.locator('[data-deposit-state="paid"]').count()).toBe(0);
    } finally {
      await releaseWebhooks();
    }
    await page.reload();
    expect(await paidBox(page)).toContain('Deposit paid: €500.00');
    await page.close();
  });

  it('decline, go back, and pay later from the proof page; the approval stands meanwhile', async () => {
    const { path } = await proofPath();
    const page = await suite.browser.newPage();
    await page.goto(`${BASE_URL}${path}`);
    await approveOn(page);
    await onPayPage(page);
    await page.getByRole('button', { name: 'Decline' }).click();
    await page.getByRole('heading', { name: 'The payment was declined' }).waitFor();
    await page.getByRole('link', { name: 'Go back to the shop' }).click();
    await page.waitForURL(`${BASE_URL}${path}?deposit=cancelled`);
    await page.getByText(/You left the payment page without paying\. Your approval stands/).waitFor();
    await page.getByText(/Approved by Ines Calloway/).waitFor();
    expect(await depositState(page)).toBe('awaiting_payment');

    await page.getByRole('button', { name: 'Pay the deposit (€500.00)' }).click();
    await onPayPage(page);
    await page.getByRole('link', { name: 'Cancel and go back to the shop' }).click();
    await page.waitForURL(`${BASE_URL}${path}?deposit=cancelled`);
    await page.getByRole('button', { name: 'Pay the deposit (€500.00)' }).click();
    await onPayPage(page);
    await payOn(page);
    expect(await paidBox(page)).toContain('Deposit paid: €500.00');
    await page.close();
  });

  it('an amount changed in the browser is ignored: the pay page asks for the deposit', async () => {
    const { path } = await proofPath();
    const page = await suite.browser.newPage();
    await page.route('**/deposit-checkout', (route) => route.continue({ postData: JSON.stringify({ amountMinor: 1, currency: 'JPY' }) }));
    await page.goto(`${BASE_URL}${path}`);
    await approveOn(page);
    await onPayPage(page);
    const id = new URL(page.url()).pathname.split('/').pop();
    expect((await fakeSessions()).find((s) => s.id === id)).toMatchObject({ amount_total: 50_000, currency: 'eur' });
    await page.close();
  });
});

describe('production mode without payment settings', () => {
  it('deposits are off with a clear message; proofs without a deposit work as before', async () => {
    const server = await startBuiltServer({
      env: { KERFLINE_MODE: 'production', PAYMENTS_SECRET_KEY: undefined, PAYMENTS_WEBHOOK_SECRET: undefined, PAYMENTS_API_URL: undefined },
    });
    try {
      const headers = { cookie: suite.builder.cookie, origin: server.url, 'content-type': 'application/json' };
      const list = await fetch(`${server.url}/api/boards/${boardId}/proofs`, { headers });
      const settings = ((await list.json()) as { deposits: { offMessage: string | null } }).deposits;
      expect(settings.offMessage).toMatch(/^Deposits are off on this server: it has no payment settings/);
      const proof = { clientName: 'Ines Calloway', clientEmail: `deposit-off-${Date.now()}@wrenfield.example` };
      const withDeposit = await fetch(`${server.url}/api/boards/${boardId}/proofs`, { method: 'POST', headers, body: JSON.stringify({ ...proof, deposit: { amountMinor: 100 } }) });
      expect(withDeposit.status).toBe(503);
      expect(await withDeposit.json()).toMatchObject({ field: 'deposit', error: expect.stringMatching(/Deposits are off/) });
      const without = await fetch(`${server.url}/api/boards/${boardId}/proofs`, { method: 'POST', headers, body: JSON.stringify(proof) });
      expect(without.status).toBe(201);
      const webhook = await fetch(`${server.url}/api/payments/webhook`, { method: 'POST', headers: { 'content-type': 'application/json', 'stripe-signature': 't=1,v1=00' }, body: '{}' });
      expect(webhook.status).toBe(503);

      const context = await suite.browser.newContext();
      await context.addCookies([{ name: SESSION_COOKIE, value: suite.builder.token, url: server.url }]);
      const panel = await context.newPage();
      await panel.goto(`${server.url}/boards/${boardId}/proofs`);
      await panel.getByText(/Deposits are off on this server/).waitFor();
      expect(await panel.getByLabel(/Deposit amount/).count()).toBe(0);
      await context.close();
    } finally {
      await server.stop();
    }
  });
});
