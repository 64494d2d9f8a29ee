import { beforeAll, describe, expect, it } from 'vitest';
import { SESSION_COOKIE } from '~/lib/auth/index.server.ts';
import { createProof, revokeProof } from '~/lib/proofs/proofs.server.ts';
import { BASE_URL, saveScreenshot } from '../support/browser.ts';
import { browserSuite } from '../support/browser-suite.ts';
import { ensureDesign } from '../support/designs.ts';
import { hoverFret, readScene } from '../support/konva-scene.ts';
import { linkIn, waitForMail } from '../support/outbox.ts';
import { signInAs } from '../support/sessions.ts';

const DAY_MS = 86_400_000;

const suite = browserSuite();
let boardId: number;

beforeAll(async () => {
  boardId = await ensureDesign(suite.builder.shopId, suite.builder.id, 'Seven-string', 'seven-string-fan');
});

/** The app's link, moved onto the server under test (e-mails use APP_ORIGIN, which is the same in npm test). */
function onTestServer(link: string): string {
  const url = new URL(link);
  return `${BASE_URL}${url.pathname}`;
}

describe('the proof page\'s server-drawn board (what shows without JavaScript)', () => {
  it('draws the ukulele\'s zero fret, all 18 frets, 6 face dots of 6 mm and 5 side dots of 2 mm, nut, saddle, outline and centre line', async () => {
    const ukulele = await ensureDesign(suite.builder.shopId, suite.builder.id, 'Tenor ukulele', 'tenor-ukulele');
    const sent = await createProof(suite.builder, ukulele, { clientName: 'Ines Calloway', clientEmail: 'ines-svg@wrenfield.example', message: '', expiresInDays: 30 }, new Date());
    const html = await (await fetch(`${BASE_URL}${new URL(sent!.link).pathname}`)).text();
    const svg = /<svg[^>]*data-drawing="proof-board"[\s\S]*?<\/svg>/.exec(html)![0];
    const frets = [...svg.matchAll(/data-fret="(\d+)"/g)].map((m) => Number(m[1]));
    expect(frets).toEqual(Array.from({ length: 19 }, (_, n) => n));
    // The ukulele is drawn in inches: 6 mm = 0.23622 in, 2 mm = 0.07874 in (1 in = 25.4 mm exactly).
    const radiiMm = (part: string) => [...svg.matchAll(new RegExp(`<circle[^>]*r="([^"]+)"[^>]*data-part="${part}"`, 'g'))].map((m) => 2 * Number(m[1]) * 25.4);
    const face = radiiMm('face-dot');
    const side = radiiMm('side-dot');
    expect(face).toHaveLength(6);
    expect(side).toHaveLength(5);
    for (const d of face) expect(Math.abs(d - 6)).toBeLessThan(1e-6); // mm
    for (const d of side) expect(Math.abs(d - 2)).toBeLessThan(1e-6); // mm
    for (const part of ['nut', 'saddle', 'outline', 'centre-line']) expect(svg).toContain(`data-part="${part}"`);
  });
});

describe('Proof in Chromium (built server)', () => {
  it('the builder shares the fanned 7-string, the client opens the e-mailed link without an account and approves', async () => {
    const builderContext = await suite.browser.newContext();
    await builderContext.addCookies([{ name: SESSION_COOKIE, value: suite.builder.token, url: BASE_URL }]);
    const panel = await builderContext.newPage();
    await panel.goto(`${BASE_URL}/boards/${boardId}/proofs`);
    const email = `client-e2e-${Date.now()}@wrenfield.example`;
    await panel.getByLabel('Client name').fill('Ines Calloway');
    await panel.getByLabel('Client e-mail').fill(email);
    await panel.getByLabel('Message to the client (optional)').fill('The fan we talked about: square at fret 8.');
    await expect(panel.getByLabel('Link expires after (days)').inputValue()).resolves.toBe('30');
    await panel.getByRole('button', { name: 'Send proof of the current revision' }).click();
    await panel.getByText(`Proof sent to ${email}`).waitFor();
    const shownLink = await panel.getByLabel(/Link for the client/).inputValue();

    const mail = await waitForMail(email, /./);
    expect(linkIn(mail, '/p/').url).toBe(shownLink);

    const clientContext = await suite.browser.newContext();
    expect(await clientContext.cookies()).toEqual([]);
    const proof = await clientContext.newPage();
    const response = await proof.goto(onTestServer(shownLink));
    expect(response?.status()).toBe(200);
    const headers = response!.headers();
    expect(headers['x-robots-tag']).toContain('noindex');
    expect(headers['referrer-policy']).toBe('no-referrer');
    expect(headers['cache-control']).toContain('no-store');
    expect(headers['cache-control']).toContain('private');
    expect(await proof.locator('meta[name="robots"]').getAttribute('content')).toContain('noindex');

    await expect(proof.getByRole('heading', { level: 1 }).textContent()).resolves.toBe('Demo: seven-string multi-scale guitar');
    const specs = await proof.locator('dl').textContent();
    expect(specs).toContain('648.00 mm on the treble side to 686.00 mm on the bass side');
    expect(specs).toContain('fret 8');
    expect(await proof.getByText('The fan we talked about: square at fret 8.').count()).toBe(1);
    // The drawing is the Layout editor's view-only island: the Konva scene has every fret, and
    // pointing at fret 12 reads out its distances (12-TET: fret 12 halves each string, 2:1 octave).
    await proof.waitForFunction(() => (window as unknown as { Konva?: { stages: unknown[] } }).Konva?.stages.length === 1);
    const scene = await readScene(proof);
    expect(scene.frets.map((f) => f.fret)).toEqual(Array.from({ length: 24 }, (_, i) => i + 1));
    await hoverFret(proof, 12);
    const readout = proof.getByRole('region', { name: 'Fret 12 readout' });
    await readout.waitFor();
    const rows = await readout.getByRole('row').allInnerTexts();
    expect(rows[1]?.split(/\s+/).slice(0, 2)).toEqual(['1', '324.00']);
    expect(rows[7]?.split(/\s+/).slice(0, 2)).toEqual(['7', '343.00']);
    expect(await proof.getByRole('table', { name: 'Fret table' }).getByRole('row').count()).toBe(1 + 7 * 24);
    // View only: no form, no saving, no Boards tabs.
    expect(await proof.getByLabel('Strings', { exact: true }).count()).toBe(0);
    expect(await proof.getByRole('tab', { name: 'History' }).count()).toBe(0);
    expect(await proof.getByRole('button', { name: 'Save to Boards' }).count()).toBe(0);
    await saveScreenshot(proof, 'proof-view-island');

    const html = await proof.content();
    for (const leak of [`/boards/${boardId}`, '/api/boards', 'boardId', 'shopId']) expect(html).not.toContain(leak);

    const approve = proof.getByRole('form', { name: 'Approve' });
    await approve.getByLabel('Your name').fill('Ines Calloway');
    await approve.getByRole('checkbox').check();
    await approve.getByRole('button', { name: 'Approve' }).click();
    await proof.getByRole('heading', { name: /^Approved by Ines Calloway on / }).waitFor();
    expect(await proof.getByRole('form', { name: 'Approve' }).count()).toBe(0);
    expect(await proof.getByRole('form', { name: 'Request changes' }).count()).toBe(0);
    await saveScreenshot(proof, 'proof-approved');

    // The builder sees the answer on Boards, in words.
    await panel.goto(`${BASE_URL}/boards?q=${encodeURIComponent('Demo: seven-string multi-scale guitar')}`);
    const boardRow = panel.getByRole('row').filter({ has: panel.getByRole('link', { name: 'Demo: seven-string multi-scale guitar', exact: true }) });
    await boardRow.waitFor();
    expect(await boardRow.locator('[data-label="status"]').textContent()).toBe('Approved');
    await saveScreenshot(panel, 'proof-boards-approved');
    await boardRow.getByRole('link', { name: 'Proofs of Demo: seven-string multi-scale guitar' }).click();
    const row = panel.getByRole('row').filter({ hasText: email });
    await row.waitFor();
    expect(await row.locator('[data-label="state"]').textContent()).toBe('approved');
    expect(await row.textContent()).toContain('Approved by Ines Calloway');
    await saveScreenshot(panel, 'proof-panel-approved');
    const answerMail = await waitForMail(suite.builder.email, /^Proof approved: a client answered on Kerfline$/);
    expect(answerMail.text).toContain('Ines Calloway approved revision');
    await builderContext.close();
    await clientContext.close();
  });

  it('a signed-in client finds the proof under Shared with me and asks for changes there', async () => {
    const client = await signInAs('client@wrenfield.example');
    const sent = await createProof(suite.builder, boardId, { clientName: 'Ines Calloway', clientEmail: client.email, message: 'Second look', expiresInDays: 30 }, new Date());
    const context = await suite.browser.newContext();
    await context.addCookies([{ name: SESSION_COOKIE, value: client.token, url: BASE_URL }]);
    const page = await context.newPage();
    await page.goto(`${BASE_URL}/shared`);
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Shared with me' }).waitFor();
    await page.locator(`a[href="/shared/${sent!.proof.id}"]`).click();
    await page.getByRole('heading', { level: 1, name: 'Demo: seven-string multi-scale guitar' }).waitFor();
    const changes = page.getByRole('form', { name: 'Request changes' });
    await changes.getByLabel('Your name').fill('Ines Calloway');
    await changes.getByLabel(/What should change/).fill('Could the bass side be 690 mm?');
    await changes.getByRole('button', { name: 'Request changes' }).click();
    await page.getByRole('heading', { name: /^Changes requested by Ines Calloway on / }).waitFor();
    expect(await page.getByText('Could the bass side be 690 mm?').count()).toBe(1);
    await page.goto(`${BASE_URL}/shared`);
    const row = await page.getByRole('row').filter({ has: page.locator(`a[href="/shared/${sent!.proof.id}"]`) }).textContent();
    expect(row?.replace(/\s+/g, ' ')).toContain('changes requested by Ines Calloway');
    await context.close();
  });

  it('unknown, expired, revoked and malformed links all get the same 404 page', async () => {
    const input = { clientName: 'C', clientEmail: `gone-${Date.now()}@wrenfield.example`, message: '', expiresInDays: 1 };
    const expired = await createProof(suite.builder, boardId, input, new Date(Date.now() - 2 * DAY_MS));
    const revoked = await createProof(suite.builder, boardId, input, new Date());
    await revokeProof(suite.builder.shopId, revoked!.proof.id, new Date());
    const paths = ['/p/AAAAAAAAAAAAAAAAAAAAAA', new URL(expired!.link).pathname, new URL(revoked!.link).pathname, '/p/not-a-token'];
    const answers = [];
    for (const path of paths) {
      const response = await fetch(`${BASE_URL}${path}`);
      answers.push({
        status: response.status,
        robots: response.headers.get('x-robots-tag'),
        referrer: response.headers.get('referrer-policy'),
        cache: response.headers.get('cache-control'),
        body: await response.text(),
      });
    }
    expect(answers[0]).toMatchObject({ status: 404, robots: 'noindex, nofollow', referrer: 'no-referrer', cache: 'private, no-store' });
    expect(answers[0]!.body).toContain('This proof is not available');
    for (const answer of answers.slice(1)) expect(answer).toEqual(answers[0]);
  });
});
