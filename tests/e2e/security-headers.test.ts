/**
 * Security headers on every kind of response of the built server, and a page CSP that allows
 * only the app's own origin (CSP Level 3, W3C: fetch directives fall back to default-src).
 */
import { createHash } from 'node:crypto';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BASE_URL, launchBrowser } from '../support/browser.ts';

type Policy = Map<string, string[]>;

function parsePolicy(text: string): Policy {
  const policy: Policy = new Map();
  for (const part of text.split(';')) {
    const [name, ...sources] = part.trim().split(/\s+/);
    if (name && !policy.has(name.toLowerCase())) policy.set(name.toLowerCase(), sources);
  }
  return policy;
}

/** Policies from the header (comma-joined when several) and from any <meta http-equiv>. */
function pagePolicies(response: Response, html: string): Policy[] {
  const header = response.headers.get('content-security-policy');
  const fromHeader = header ? header.split(',').map(parsePolicy) : [];
  const fromMeta = [...html.matchAll(/<meta[^>]+http-equiv=["']content-security-policy["'][^>]*>/gi)].map((m) => {
    const content = /content=(["'])(.*?)\1/i.exec(m[0]);
    return parsePolicy((content?.[2] ?? '').replace(/&#39;|&apos;/g, "'"));
  });
  return [...fromHeader, ...fromMeta];
}

/** script-src, or default-src where a policy has none (CSP3 fallback). */
function scriptSources(policy: Policy): string[] | undefined {
  return policy.get('script-src') ?? policy.get('default-src');
}

/** Sources that allow nothing beyond this origin: 'self', 'none', hashes and nonces. */
const OWN_ORIGIN_ONLY = /^('self'|'none'|'sha(256|384|512)-[A-Za-z0-9+/=]+'|'nonce-[A-Za-z0-9+/=]+')$/;
/** Images may also be data: and blob: URLs made by the page itself (canvas exports). */
const OWN_IMAGE_SOURCES = /^(data:|blob:)$/;
const FETCH_DIRECTIVES = ['default-src', 'script-src', 'style-src', 'img-src', 'font-src', 'connect-src', 'object-src', 'frame-src', 'worker-src', 'media-src'];

const REQUIRED_HEADERS: Record<string, RegExp> = {
  'x-content-type-options': /^nosniff$/,
  'referrer-policy': /^(same-origin|no-referrer|strict-origin|strict-origin-when-cross-origin)$/,
  'x-frame-options': /^DENY$/,
  'content-security-policy': /frame-ancestors 'none'/,
};

async function firstAssetPath(): Promise<string> {
  const html = await (await fetch(`${BASE_URL}/`)).text();
  const asset = /(?:href|src)="(\/_astro\/[^"]+)"/.exec(html)?.[1];
  if (!asset) throw new Error('the home page links no /_astro/ asset');
  return asset;
}

describe('security headers on every kind of response', () => {
  const kinds: [string, () => Promise<Response>, number][] = [
    ['home page', () => fetch(`${BASE_URL}/`), 200],
    ['404 page', () => fetch(`${BASE_URL}/no-such-page`), 404],
    ['API JSON', () => fetch(`${BASE_URL}/api/version`), 200],
    ['API error (bad JSON)', () => fetch(`${BASE_URL}/api/layout`, { method: 'POST', headers: { 'content-type': 'application/json', origin: BASE_URL }, body: '{' }), 400],
    ['API error (cross-site POST)', () => fetch(`${BASE_URL}/api/layout`, { method: 'POST', headers: { 'content-type': 'application/json', origin: 'http://elsewhere.example' }, body: '{}' }), 403],
    ['static asset (/_astro)', async () => fetch(`${BASE_URL}${await firstAssetPath()}`), 200],
    ['static file (favicon)', () => fetch(`${BASE_URL}/favicon.svg`), 200],
  ];
  for (const [kind, request, status] of kinds) {
    it(`${kind} carries nosniff, Referrer-Policy, X-Frame-Options and CSP frame-ancestors`, async () => {
      const response = await request();
      expect(response.status).toBe(status);
      for (const [name, pattern] of Object.entries(REQUIRED_HEADERS)) {
        expect(response.headers.get(name), name).toMatch(pattern);
      }
    });
  }
});

describe('page Content-Security-Policy', () => {
  for (const path of ['/', '/no-such-page']) {
    it(`${path} allows scripts and every fetch only from its own origin, no 'unsafe-inline' or 'unsafe-eval'`, async () => {
      const response = await fetch(`${BASE_URL}${path}`);
      const html = await response.text();
      const policies = pagePolicies(response, html);
      const restricting = policies.filter((p) => scriptSources(p));
      expect(restricting.length).toBeGreaterThan(0);
      for (const policy of restricting) {
        expect(policy.get('default-src')).toEqual(["'self'"]);
        for (const directive of FETCH_DIRECTIVES) {
          for (const source of policy.get(directive) ?? []) {
            const allowed = OWN_ORIGIN_ONLY.test(source) || (directive === 'img-src' && OWN_IMAGE_SOURCES.test(source));
            expect(allowed, `${directive} ${source}`).toBe(true);
          }
        }
      }
    });
  }

  it("hashes every inline script of the home page into script-src (so none runs unlisted)", async () => {
    const response = await fetch(`${BASE_URL}/`);
    const html = await response.text();
    const sources = pagePolicies(response, html).map(scriptSources).find(Boolean) ?? [];
    const inline = [...html.matchAll(/<script(?![^>]*\bsrc=)[^>]*>([\s\S]*?)<\/script>/gi)].map((m) => m[1]!);
    for (const body of inline) {
      const hash = `'sha256-${createHash('sha256').update(body).digest('base64')}'`;
      expect(sources, `inline script starting ${body.slice(0, 40)}`).toContain(hash);
    }
  });
});

describe('pages in Chromium', () => {
  let browser: Browser;
  beforeAll(async () => {
    browser = await launchBrowser();
  });
  afterAll(() => browser?.close());

  it('load the home and 404 pages with zero CSP violations, and the detector does see a deliberate one', async () => {
    const page = await browser.newPage();
    const problems: string[] = [];
    page.on('pageerror', (e) => problems.push(`page error: ${e.message}`));
    page.on('console', (m) => {
      if (/content security policy/i.test(m.text())) problems.push(`console: ${m.text()}`);
    });
    await page.addInitScript(() => {
      const seen: string[] = [];
      (window as unknown as { cspViolations: string[] }).cspViolations = seen;
      document.addEventListener('securitypolicyviolation', (e) => seen.push(`${e.violatedDirective} ${e.blockedURI}`));
    });
    const violations = () => page.evaluate(() => (window as unknown as { cspViolations: string[] }).cspViolations);
    for (const path of ['/', '/no-such-page']) {
      await page.goto(`${BASE_URL}${path}`, { waitUntil: 'networkidle' });
      expect(await violations(), path).toEqual([]);
      expect(problems, path).toEqual([]);
    }
    await page.evaluate(() => {
      const script = document.createElement('script');
      script.textContent = 'window.inlineRan = true';
      document.body.append(script);
    });
    await page.waitForFunction(() => (window as unknown as { cspViolations: string[] }).cspViolations.length > 0);
    expect(await page.evaluate(() => (window as unknown as { inlineRan?: boolean }).inlineRan)).toBeUndefined();
    expect((await violations())[0]).toMatch(/^script-src/);
  });
});
