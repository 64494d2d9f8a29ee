import { describe, expect, it } from 'vitest';
import { isSameOriginRequest } from '~/lib/http/same-origin.ts';

const APP = 'http://127.0.0.1:4321';

function check(method: string, headers: Record<string, string>): boolean {
  return isSameOriginRequest(new Request(`${APP}/api/x`, { method, headers }), [APP]);
}

describe('same-origin (CSRF) check', () => {
  it('lets reads through whatever their origin', () => {
    expect(check('GET', { origin: 'https://evil.example' })).toBe(true);
  });

  it('accepts a write from the app itself and refuses one from another site', () => {
    expect(check('POST', { origin: APP })).toBe(true);
    expect(check('POST', { origin: 'https://evil.example' })).toBe(false);
    expect(check('PUT', { origin: 'https://evil.example' })).toBe(false);
    expect(check('POST', { origin: 'null' })).toBe(false);
  });

  it('refuses what the browser marks as cross-site, whatever the headers claim', () => {
    expect(check('POST', { origin: APP, 'sec-fetch-site': 'cross-site' })).toBe(false);
    expect(check('POST', { origin: APP, 'sec-fetch-site': 'same-site' })).toBe(false);
    expect(check('POST', { origin: APP, 'sec-fetch-site': 'same-origin' })).toBe(true);
  });

  it('falls back to the Referer when there is no Origin, and refuses a write naming neither', () => {
    expect(check('POST', { referer: `${APP}/layout` })).toBe(true);
    expect(check('POST', { referer: 'https://evil.example/page' })).toBe(false);
    expect(check('DELETE', {})).toBe(false);
  });
});
