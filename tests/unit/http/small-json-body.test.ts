/**
 * Small JSON bodies read in front of the adapter (scripts/lib/small-json-body.mjs): the Request
 * the adapter builds from the read body (astro/app/node's NodeApp.createRequest, as the built
 * server does) carries exactly the bytes the client sent, and only small declared JSON bodies are
 * read there.
 */
import http, { type IncomingMessage } from 'node:http';
import type { AddressInfo } from 'node:net';
import { NodeApp } from 'astro/app/node';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { isSmallJsonBody, readSmallJsonBody, SMALL_JSON_MAX_BYTES } from '../../../scripts/lib/small-json-body.mjs';

let server: http.Server;
let origin: string;

/** Answers with what the adapter's Request holds: whether the body was read in front, and its bytes in hex. */
beforeAll(async () => {
  server = http.createServer((req, res) => {
    const answer = async (readInFront: boolean) => {
      const request = NodeApp.createRequest(req);
      const bytes = Buffer.from(await request.arrayBuffer());
      res.setHeader('content-type', 'application/json');
      res.end(JSON.stringify({ readInFront, hex: bytes.toString('hex'), bodyKind: typeof (req as { body?: unknown }).body }));
    };
    if (isSmallJsonBody(req)) readSmallJsonBody(req, () => void answer(true));
    else void answer(false);
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  origin = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
});

afterAll(() => new Promise<void>((resolve) => server.close(() => resolve())));

async function send(body: Buffer, contentType = 'application/json'): Promise<{ readInFront: boolean; hex: string; bodyKind: string }> {
  const response = await fetch(`${origin}/api/layout`, { method: 'POST', headers: { 'content-type': contentType }, body: new Uint8Array(body) });
  return (await response.json()) as { readInFront: boolean; hex: string; bodyKind: string };
}

const hex = (bytes: Uint8Array) => Buffer.from(bytes).toString('hex');

describe('small JSON bodies read in front of the adapter', () => {
  it('the Request carries the same bytes: plain, multi-byte UTF-8, and with a byte order mark', async () => {
    const bodies = [
      Buffer.from('{"name":"Wrenfield tenor","strings":4}'),
      Buffer.from('{"name":"Señor ukulele · 12° — 𝄞"}'),
      Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), Buffer.from('{"name":"x"}')]),
    ];
    for (const body of bodies) {
      const seen = await send(body);
      expect(seen.readInFront).toBe(true);
      expect(seen.bodyKind).toBe('string');
      expect(seen.hex).toBe(hex(body));
    }
  });

  it('a body that is not valid UTF-8 reaches the route as its raw bytes (so the route still refuses it)', async () => {
    const body = Buffer.from([0x7b, 0x22, 0x6e, 0x22, 0x3a, 0x22, 0xff, 0xfe, 0xc3, 0x22, 0x7d]);
    const seen = await send(body);
    expect(seen.readInFront).toBe(true);
    expect(seen.bodyKind).toBe('object');
    expect(seen.hex).toBe(hex(body));
  });

  it('larger bodies and other media types stream to the adapter as before', async () => {
    const large = Buffer.from(`{"name":"${'x'.repeat(SMALL_JSON_MAX_BYTES)}"}`);
    const seenLarge = await send(large);
    expect(seenLarge.readInFront).toBe(false);
    expect(seenLarge.hex).toBe(hex(large));
    const form = Buffer.from('a=1&b=2');
    const seenForm = await send(form, 'application/x-www-form-urlencoded');
    expect(seenForm.readInFront).toBe(false);
    expect(seenForm.hex).toBe(hex(form));
  });

  it('reads only declared, non-empty JSON bodies up to the limit, never GET or chunked ones', () => {
    const req = (method: string, headers: Record<string, string>) => ({ method, headers }) as unknown as IncomingMessage;
    const json = { 'content-type': 'application/json; charset=utf-8' };
    expect(isSmallJsonBody(req('POST', { ...json, 'content-length': '120' }))).toBe(true);
    expect(isSmallJsonBody(req('PATCH', { ...json, 'content-length': String(SMALL_JSON_MAX_BYTES) }))).toBe(true);
    expect(isSmallJsonBody(req('POST', { ...json, 'content-length': String(SMALL_JSON_MAX_BYTES + 1) }))).toBe(false);
    expect(isSmallJsonBody(req('POST', { ...json, 'content-length': '0' }))).toBe(false);
    expect(isSmallJsonBody(req('POST', { ...json }))).toBe(false);
    expect(isSmallJsonBody(req('POST', { ...json, 'transfer-encoding': 'chunked' }))).toBe(false);
    expect(isSmallJsonBody(req('POST', { ...json, 'content-length': '1e3' }))).toBe(false);
    expect(isSmallJsonBody(req('GET', { ...json, 'content-length': '12' }))).toBe(false);
    expect(isSmallJsonBody(req('POST', { 'content-type': 'text/plain', 'content-length': '12' }))).toBe(false);
  });
});
