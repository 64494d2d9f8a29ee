import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { fretTableCsv } from '~/lib/export/csv.ts';
import { expandLayout, type CompactLayout } from '~/lib/geometry/compact-layout.ts';
import { computeLayout } from '~/lib/geometry/layout.ts';
import * as layoutRoute from '~/pages/api/layout.ts';
import { invalidFieldArbitrary } from '../geometry/design-arbitraries.ts';
import { designInput, validDesign, withField } from '../../support/design-builders.ts';
import { callRoute } from '../../support/route-call.ts';

const FAN = designInput({ strings: 7, scale: { treble: 648, bass: 686 }, perpendicularFret: 8 });

function post(body: string | Uint8Array, headers: Record<string, string> = { 'content-type': 'application/json' }, path = '/api/layout') {
  return callRoute(layoutRoute.POST, { method: 'POST', path, headers, body });
}

async function errorBody(response: Response): Promise<{ error: string; field?: string; issues?: { path: string; message: string }[] }> {
  expect(response.headers.get('content-type')).toMatch(/^application\/json/);
  return (await response.json()) as { error: string; field?: string; issues?: { path: string; message: string }[] };
}

describe('POST /api/layout handler', () => {
  it('returns the compact layout (docs/api.md), which expands to what the geometry module computed', async () => {
    const response = await post(JSON.stringify(FAN));
    expect(response.status).toBe(200);
    expect(response.headers.get('content-type')).toBe('application/json; charset=utf-8');
    const compact = (await response.json()) as CompactLayout;
    expect(compact.frets).toHaveLength(FAN.frets as number);
    expect(JSON.parse(JSON.stringify(expandLayout(compact)))).toEqual(JSON.parse(JSON.stringify(computeLayout(validDesign(FAN)))));
  });

  it('returns the full layout for ?full=1, as the geometry module computed it', async () => {
    const response = await post(JSON.stringify(FAN), { 'content-type': 'application/json' }, '/api/layout?full=1');
    expect(response.status).toBe(200);
    expect(response.headers.get('content-type')).toBe('application/json; charset=utf-8');
    expect(await response.json()).toEqual(JSON.parse(JSON.stringify(computeLayout(validDesign(FAN)))));
  });

  it('returns the fret table CSV for ?format=csv and for Accept: text/csv', async () => {
    const expected = fretTableCsv(computeLayout(validDesign(FAN)));
    for (const response of [
      await post(JSON.stringify(FAN), { 'content-type': 'application/json' }, '/api/layout?format=csv'),
      await post(JSON.stringify(FAN), { 'content-type': 'application/json', accept: 'text/csv' }),
    ]) {
      expect(response.status).toBe(200);
      expect(response.headers.get('content-type')).toBe('text/csv; charset=utf-8');
      expect(await response.text()).toBe(expected);
    }
  });

  it('400 for an unknown format, naming it', async () => {
    const response = await post(JSON.stringify(FAN), { 'content-type': 'application/json' }, '/api/layout?format=xls');
    expect(response.status).toBe(400);
    expect((await errorBody(response)).field).toBe('format');
  });

  it.each([['text/plain'], ['application/x-www-form-urlencoded'], ['']])('415 for content type %j', async (type) => {
    // Bytes carry no Content-Type of their own, so '' sends none at all.
    const response = await post(new TextEncoder().encode(JSON.stringify(FAN)), type === '' ? {} : { 'content-type': type });
    expect(response.status).toBe(415);
    expect((await errorBody(response)).error).toContain('application/json');
  });

  it('400 for a body that is not JSON', async () => {
    const response = await post('{"name": "unterminated');
    expect(response.status).toBe(400);
    expect((await errorBody(response)).error).toContain('not valid JSON');
  });

  it.each([
    ['wrong type', { ...FAN, strings: 'six' }, 'strings'],
    ['missing field', { ...FAN, frets: undefined }, 'frets'],
    ['negative length', { ...FAN, scale: { treble: -648, bass: 686 } }, 'scale.treble'],
    ['zero length', { ...FAN, stringSpacing: { nut: 0, bridge: 60 } }, 'stringSpacing.nut'],
    ['1e308', { ...FAN, scale: { treble: 648, bass: 1e308 } }, 'scale.bass'],
    ['"NaN" string', { ...FAN, scale: { treble: 'NaN', bass: 686 } }, 'scale.treble'],
    ['10,000 strings', { ...FAN, strings: 10_000 }, 'strings'],
    ['Scala text with a missing count', { ...FAN, temperament: { kind: 'scala', scl: 'Only a description\n' } }, 'temperament.scl'],
    ['Scala text with a zero ratio', { ...FAN, temperament: { kind: 'scala', scl: 'Zero\n2\n0/1\n2/1\n' } }, 'temperament.scl'],
  ])('400 for %s, naming the field', async (_label, design, path) => {
    const response = await post(JSON.stringify(design));
    expect(response.status).toBe(400);
    const body = await errorBody(response);
    expect(body.field).toBe(path);
    expect(body.error).toContain(path);
    expect(body.issues?.map((issue) => issue.path)).toContain(path);
  });

  it('413 for a 5 MB body, by Content-Length and by actual bytes', async () => {
    const big = `{"name":"${'x'.repeat(5 * 1024 * 1024)}"}`;
    const declared = await post(big, { 'content-type': 'application/json', 'content-length': String(big.length) });
    expect(declared.status).toBe(413);
    const streamed = await callRoute(layoutRoute.POST, { method: 'POST', path: '/api/layout', headers: { 'content-type': 'application/json' }, body: new TextEncoder().encode(big) });
    expect(streamed.status).toBe(413);
  });

  it('accepts a body just under 64 KiB', async () => {
    const padded = JSON.stringify({ ...FAN, name: 'x'.repeat(100) });
    expect(padded.length).toBeLessThan(64 * 1024);
    expect((await post(padded)).status).toBe(200);
  });

  it('property: random invalid designs get 400 naming the field (fast-check)', async () => {
    await fc.assert(
      fc.asyncProperty(invalidFieldArbitrary, async ([path, value]) => {
        const input = withField(path, value);
        const response = await post(JSON.stringify(input));
        expect(response.status).toBe(400);
        const body = await errorBody(response);
        // JSON has no NaN or Infinity: they arrive as null, still rejected at the same field.
        expect(body.issues?.map((issue) => issue.path)).toContain(path);
      }),
      { numRuns: 100 },
    );
  });
});
