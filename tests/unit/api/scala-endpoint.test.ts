import { describe, expect, it } from 'vitest';
import * as scalaRoute from '~/pages/api/scala.ts';
import { callRoute } from '../../support/route-call.ts';

function post(body: string | Uint8Array, type = 'text/plain') {
  return callRoute(scalaRoute.POST, { method: 'POST', path: '/api/scala', headers: { 'content-type': type }, body });
}

describe('POST /api/scala handler', () => {
  it('returns description, pitches (cents and ratios) and period', async () => {
    const response = await post('! just.scl\nJust fifth and octave\n2\n3/2\n1200.0\n');
    expect(response.status).toBe(200);
    const body = (await response.json()) as {
      description: string;
      pitches: { text: string; cents: number; ratio: number }[];
      period: { ratio: number };
    };
    expect(body.description).toBe('Just fifth and octave');
    expect(body.pitches.map((p) => [p.text, p.ratio])).toEqual([['3/2', 1.5], ['1200.0', 2]]);
    expect(Math.abs(body.pitches[0]!.cents - 1200 * Math.log2(1.5))).toBeLessThan(1e-9); // cents
    expect(body.period.ratio).toBe(2);
  });

  it('accepts application/octet-stream uploads', async () => {
    const response = await post(new TextEncoder().encode('Octave\n1\n2/1\n'), 'application/octet-stream');
    expect(response.status).toBe(200);
  });

  it.each([
    ['missing count', 'Description only\n', 2],
    ['zero ratio', 'Zero\n2\n0/1\n2/1\n', 3],
  ])('400 for a %s, with the line number', async (_label, text, line) => {
    const response = await post(text);
    expect(response.status).toBe(400);
    const body = (await response.json()) as { error: string; line: number };
    expect(body.line).toBe(line);
    expect(body.error).toMatch(new RegExp(`^line ${line}: `));
  });

  it('415 for JSON, 413 above 64 KiB', async () => {
    expect((await post('{}', 'application/json')).status).toBe(415);
    expect((await post(`Big\n1\n2/1\n${'!'.repeat(70 * 1024)}\n`)).status).toBe(413);
  });
});
