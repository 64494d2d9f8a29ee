import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { BASE_URL } from '../support/browser.ts';

const fan = readFileSync('src/lib/boards/demo/seven-string-fan.json', 'utf8');

function post(body: string, headers: Record<string, string> = {}, query = ''): Promise<Response> {
  return fetch(`${BASE_URL}/api/layout${query}`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', origin: BASE_URL, ...headers },
    body,
  });
}

describe('POST /api/layout on the built server', () => {
  it('answers a script (no cookie, Origin set) with the fret table CSV for the fanned 7-string', async () => {
    const response = await post(fan, {}, '?format=csv');
    expect(response.status).toBe(200);
    expect(response.headers.get('content-type')).toMatch(/^text\/csv/);
    const lines = (await response.text()).trim().split('\n');
    expect(lines[0]).toBe('fret,string,scale_length,from_nut,from_previous,x,y');
    expect(lines).toHaveLength(1 + 24 * 7);
  });

  it('answers JSON whose outer strings have the design scale lengths', async () => {
    const response = await post(fan);
    expect(response.status).toBe(200);
    const layout = (await response.json()) as { strings: { index: number; scaleLength: number }[] };
    expect(layout.strings[0]!.scaleLength).toBe(648);
    expect(layout.strings.at(-1)!.scaleLength).toBe(686);
  });

  it('refuses a write from another site, or naming no origin, with 403 (CSRF)', async () => {
    expect((await post(fan, { origin: 'https://elsewhere.example' })).status).toBe(403);
    const noOrigin = await fetch(`${BASE_URL}/api/layout`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: fan });
    expect(noOrigin.status).toBe(403);
  });

  it('answers bad input with 4xx naming the field, never a 500', async () => {
    const invalid = await post(JSON.stringify({ ...JSON.parse(fan), frets: 0 }));
    expect(invalid.status).toBe(400);
    expect(((await invalid.json()) as { field: string }).field).toBe('frets');
    expect((await post('{not json')).status).toBe(400);
    expect((await post(fan, { 'content-type': 'text/plain' })).status).toBe(415);
    expect((await post(`{"name":"${'x'.repeat(5 * 1024 * 1024)}"}`)).status).toBe(413);
  });
});
