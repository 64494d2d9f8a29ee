/** The honest client address in front of the adapter (scripts/lib/client-address.mjs, over proxy-addr). */
import type { IncomingMessage } from 'node:http';
import { describe, expect, it } from 'vitest';
import { clientAddressOf, compileTrustedProxies, makeForwardingHonest } from '../../../scripts/lib/client-address.mjs';

function request(peer: string | undefined, headers: Record<string, string> = {}): IncomingMessage {
  return { socket: { remoteAddress: peer }, headers: { ...headers } } as unknown as IncomingMessage;
}

describe('client address', () => {
  it('an untrusted peer is the address, whatever X-Forwarded-For it sends', () => {
    const trust = compileTrustedProxies(undefined);
    for (let i = 0; i < 20; i++) {
      expect(clientAddressOf(request('198.51.100.7', { 'x-forwarded-for': `203.0.113.${i}` }), trust)).toBe('198.51.100.7');
    }
    // Trusting only another proxy changes nothing for this peer either.
    expect(clientAddressOf(request('198.51.100.7', { 'x-forwarded-for': '203.0.113.1' }), compileTrustedProxies('10.0.0.1'))).toBe('198.51.100.7');
  });

  it('a trusted peer: the right-most untrusted X-Forwarded-For entry ("a, b, trustedProxy")', () => {
    const trust = compileTrustedProxies('loopback, 10.0.0.0/8');
    const chain = { 'x-forwarded-for': '203.0.113.1, 198.51.100.2, 10.1.2.3' };
    expect(clientAddressOf(request('127.0.0.1', chain), trust)).toBe('198.51.100.2');
    // The left-most entries are whatever the client typed: rotating them changes nothing.
    expect(clientAddressOf(request('127.0.0.1', { 'x-forwarded-for': '192.0.2.99, 198.51.100.2, 10.1.2.3' }), trust)).toBe('198.51.100.2');
    // A trusted peer without the header is itself the client.
    expect(clientAddressOf(request('127.0.0.1'), trust)).toBe('127.0.0.1');
  });

  it('rewrites the headers the adapter reads: one honest X-Forwarded-For; forwarded host only from a trusted proxy', () => {
    const untrusted = request('198.51.100.7', { 'x-forwarded-for': '203.0.113.5', 'x-forwarded-host': 'evil.example', 'x-forwarded-proto': 'https' });
    makeForwardingHonest(untrusted, compileTrustedProxies(''));
    expect(untrusted.headers).toEqual({ 'x-forwarded-for': '198.51.100.7' });

    const viaProxy = request('127.0.0.1', { 'x-forwarded-for': '203.0.113.5', 'x-forwarded-proto': 'https' });
    makeForwardingHonest(viaProxy, compileTrustedProxies('loopback'));
    expect(viaProxy.headers).toEqual({ 'x-forwarded-for': '203.0.113.5', 'x-forwarded-proto': 'https' });
  });

  it('a socket already gone is "unknown"; a bad TRUSTED_PROXIES entry is a readable error', () => {
    expect(clientAddressOf(request(undefined), compileTrustedProxies(''))).toBe('unknown');
    expect(() => compileTrustedProxies('loopback, not-an-address')).toThrow(/TRUSTED_PROXIES: .*not-an-address/);
  });
});
