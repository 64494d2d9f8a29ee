import { existsSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { ROUTE_BUDGETS } from '~/lib/http/rate-budgets.ts';
import { limitedRouteFor } from '~/lib/http/route-budgets.ts';

describe('route budgets: which requests count', () => {
  it('names every CPU-heavy public route and the proof page', () => {
    const cases: [string, string, string, string][] = [
      ['POST', '/api/layout', 'layout', 'src/pages/api/layout.ts'],
      ['POST', '/api/scala', 'scala', 'src/pages/api/scala.ts'],
      ['POST', '/api/export', 'export', 'src/pages/api/export.ts'],
      ['GET', '/api/boards/12/export', 'board-export', 'src/pages/api/boards/[id]/export.ts'],
      ['GET', '/api/boards/12/thumbnail.svg', 'thumbnail', 'src/pages/api/boards/[id]/thumbnail.svg.ts'],
      ['GET', '/api/templates/3/label', 'template-label', 'src/pages/api/templates/[id]/label.ts'],
      ['GET', '/api/templates/3/index-template', 'index-template', 'src/pages/api/templates/[id]/index-template.ts'],
      ['GET', '/p/AAAAAAAAAAAAAAAAAAAAAA', 'proof-page', 'src/pages/p/[token].astro'],
      ['POST', '/api/p/AAAAAAAAAAAAAAAAAAAAAA/deposit-checkout', 'deposit-checkout', 'src/pages/api/p/[token]/deposit-checkout.ts'],
      ['POST', '/api/payments/webhook', 'payment-webhook', 'src/pages/api/payments/webhook.ts'],
    ];
    for (const [method, path, budget, file] of cases) {
      expect(limitedRouteFor(method, path)?.budget, `${method} ${path}`).toBe(budget);
      expect(existsSync(file), file).toBe(true);
    }
    expect(new Set(cases.map((c) => c[2]))).toEqual(new Set(Object.keys(ROUTE_BUDGETS)));
  });

  it('counts the spellings the router also serves: trailing slash, percent-encoding, HEAD', () => {
    expect(limitedRouteFor('POST', '/api/layout/')?.budget).toBe('layout');
    expect(limitedRouteFor('POST', '/api/%6Cayout')?.budget).toBe('layout');
    expect(limitedRouteFor('post', '/api/layout')?.budget).toBe('layout');
    expect(limitedRouteFor('HEAD', '/api/boards/1/export')?.budget).toBe('board-export');
  });

  it('leaves other routes and methods alone', () => {
    expect(limitedRouteFor('GET', '/api/layout')).toBeNull();
    expect(limitedRouteFor('GET', '/api/version')).toBeNull();
    expect(limitedRouteFor('POST', '/api/boards/1/proofs')).toBeNull();
    expect(limitedRouteFor('GET', '/api/boards/1/export/extra')).toBeNull();
    expect(limitedRouteFor('GET', '/api/%E0%A4%A')).toBeNull();
  });

  it('routes that work without MariaDB keep counting per process while it is down; the proof page keeps its headers', () => {
    expect(limitedRouteFor('POST', '/api/layout')?.needsDatabase).toBe(false);
    expect(limitedRouteFor('GET', '/api/boards/1/export')?.needsDatabase).toBe(true);
    expect(limitedRouteFor('GET', '/p/x')?.headers?.['referrer-policy']).toBe('no-referrer');
  });
});
