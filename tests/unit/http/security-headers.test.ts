import { describe, expect, it } from 'vitest';
import { DYNAMIC_RESPONSE_HEADERS, mergeCsp, securedHeaders, SECURITY_HEADERS, withSecurityHeaders } from '~/lib/http/security-headers.ts';

describe('mergeCsp', () => {
  it("adds the base policy's directives the page policy lacks, keeping the page's own", () => {
    const merged = mergeCsp("default-src 'self'; script-src 'self' 'sha256-abc='; object-src 'none';", "frame-ancestors 'none'; object-src 'self'");
    expect(merged).toBe("default-src 'self'; script-src 'self' 'sha256-abc='; object-src 'none'; frame-ancestors 'none'");
  });

  it('leaves a policy that already has every directive unchanged', () => {
    expect(mergeCsp("frame-ancestors 'self'", "frame-ancestors 'none'")).toBe("frame-ancestors 'self'");
  });
});

describe('securedHeaders / withSecurityHeaders', () => {
  it('adds every security header to a bare response', () => {
    const response = withSecurityHeaders(new Response('x'));
    for (const [name, value] of Object.entries(SECURITY_HEADERS)) expect(response.headers.get(name)).toBe(value);
  });

  it("merges frame-ancestors into a page's CSP header instead of dropping it", () => {
    const headers = securedHeaders(new Headers({ 'content-security-policy': "default-src 'self'" }));
    expect(headers.get('content-security-policy')).toMatch(/^default-src 'self'; .*frame-ancestors 'none'/);
  });

  it('works on responses with immutable headers (redirects)', () => {
    const response = withSecurityHeaders(Response.redirect('http://127.0.0.1/x', 303));
    expect(response.status).toBe(303);
    expect(response.headers.get('location')).toBe('http://127.0.0.1/x');
    expect(response.headers.get('x-frame-options')).toBe('DENY');
  });
});

describe('answers the app builds are never cached', () => {
  it('forces Cache-Control: no-store over a weaker policy a route set', () => {
    const response = withSecurityHeaders(new Response('x', { headers: { 'cache-control': 'private, max-age=86400' } }), DYNAMIC_RESPONSE_HEADERS);
    expect(response.headers.get('cache-control')).toBe('no-store');
  });

  it('keeps a stricter policy that already says no-store', () => {
    const response = withSecurityHeaders(new Response('x', { headers: { 'cache-control': 'private, no-store' } }), DYNAMIC_RESPONSE_HEADERS);
    expect(response.headers.get('cache-control')).toBe('private, no-store');
  });

  it('also on redirects, whose headers are immutable', () => {
    const response = withSecurityHeaders(Response.redirect('http://127.0.0.1/x', 303), DYNAMIC_RESPONSE_HEADERS);
    expect(response.headers.get('cache-control')).toBe('no-store');
  });
});
