/**
 * POST /api/export?format=gcode|cutlist|cutsheet: the files, their names from the one file-name
 * function, and 4xx answers naming the option (a cutter wider than the slot is refused).
 */
import { describe, expect, it } from 'vitest';
import * as exportRoute from '~/pages/api/export.ts';
import { callRoute } from '../../support/route-call.ts';
import { exportFileName } from '~/lib/export/file-name.ts';
import sevenStringFan from '../../../src/lib/boards/demo/seven-string-fan.json';
import { pageText, readPdf } from '../../support/pdf-readback.ts';

function post(query: string, body: unknown = sevenStringFan): Promise<Response> {
  return callRoute(exportRoute.POST, { method: 'POST', path: `/api/export${query}`, headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) });
}

describe('POST /api/export for the slot toolpath, cut list and cut sheet', () => {
  it.each([
    ['gcode', 'text/plain; charset=utf-8', '(Kerfline slot toolpath'],
    ['cutlist', 'text/csv; charset=utf-8', 'fret,slot_length,arc_length,wire_length\n'],
    ['cutsheet', 'application/pdf', '%PDF-'],
  ] as const)('answers format=%s with %s, named by the one file-name function', async (format, type, start) => {
    const response = await post(`?format=${format}`);
    expect(response.status).toBe(200);
    expect(response.headers.get('content-type')).toBe(type);
    expect(response.headers.get('content-disposition')).toBe(`attachment; filename="${exportFileName(sevenStringFan.name, format)}"`);
    const bytes = new Uint8Array(await response.arrayBuffer());
    expect(new TextDecoder().decode(bytes.subarray(0, start.length))).toBe(start);
  });

  it.each([
    ['?format=gcode&toolDiameter=0.8', 'toolDiameter', /wider than the slot/],
    ['?format=gcode&toolDiameter=-1', 'toolDiameter', /greater than 0/],
    ['?format=gcode&feed=fast', 'feed', /number/],
    ['?format=gcode&passDepth=0', 'passDepth', /greater than 0/],
    ['?format=gcode&dialect=marlin', 'dialect', /linuxcnc, grbl/],
    ['?format=gcode&zZero=table', 'zZero', /crown, edge-at-nut/],
    ['?format=gcode&zZero=edge-at-nut&safeZ=0.2', 'safeZ', /above the board top/],
    ['?format=gcode&dryRun=-5', 'dryRun', /negative/],
    ['?format=cutlist&stockLength=0', 'stockLength', /greater than 0/],
  ])('refuses %s with 400 naming %s', async (query, field, message) => {
    const response = await post(query);
    expect(response.status).toBe(400);
    const problem = (await response.json()) as { field: string; error: string };
    expect(problem.field).toBe(field);
    expect(problem.error).toMatch(message);
  });

  it('accepts a cutter exactly as wide as the slot, and a narrower one', async () => {
    expect((await post('?format=gcode&toolDiameter=0.6')).status).toBe(200);
    expect((await post('?format=gcode&toolDiameter=0.4')).status).toBe(200);
  });

  it('prints the key numbers, slot table, cut list, cautions and fingerprint on the cut sheet (two pages)', async () => {
    const bytes = new Uint8Array(await (await post('?format=cutsheet')).arrayBuffer());
    const pages = await readPdf(bytes);
    expect(pages).toHaveLength(2);
    const first = pageText(bytes, 1);
    const second = pageText(bytes, 2);
    expect(first).toContain('Shop cut sheet: Demo: seven-string multi-scale guitar');
    expect(first).toContain('Radius 254.00 mm at the nut, 406.40 mm at the last fret');
    expect(first).toContain('treble edge');
    expect(second).toContain('Fret wire cut list');
    expect(second).toContain('Secure the work');
    expect(second).toMatch(/Unsaved design · fingerprint [0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}/);
  });
});
