import { describe, expect, it } from 'vitest';
import { isSameOriginRequest } from '~/lib/http/same-origin.ts';

const APP = 'http://127.0.0.1:4321';

function check(method: string, headers: Record<string, string>, hasSessionCookie = false): boolean {
  const request = new Request(`${APP}/api/x`, { method, headers });
  return isSameOriginRequest({ request, allowedOrigins: [APP], hasSessionCookie });
}

describe('same-origin (CSRF) check', () => {
  it('lets reads through whatever their origin', () => {
    expect(check('GET', { origin: 'https://evil.example' }, true)).toBe(true);
  });

  it('accepts a write from the app itself and refuses one from another site', () => {
    expect(check('POST', { origin: APP }, true)).toBe(true);
    expect(check('POST', { origin: 'https://evil.example' }, true)).toBe(false);
    expect(check('PUT', { origin: 'https://evil.example' })).toBe(false);
    expect(check('POST', { origin: 'null' }, true)).toBe(false);
  });

  it('refuses what the browser marks as cross-site even without an Origin header', () => {
    expect(check('POST', { 'sec-fetch-site': 'cross-site' })).toBe(false);
    expect(check('POST', { 'sec-fetch-site': 'same-site' })).toBe(false);
  });

  it('falls back to the Referer when there is no Origin', () => {
    expect(check('POST', { referer: `${APP}/layout` }, true)).toBe(true);
    expect(check('POST', { referer: 'https://evil.example/page' }, true)).toBe(false);
  });

  it('lets a script without Origin and without the session cookie call public endpoints, but not a signed-in one', () => {
    expect(check('POST', {}, false)).toBe(true);
    expect(check('POST', {}, true)).toBe(false);
  });
});
