import { existsSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runKerfline } from '~/lib/cli/run-kerfline.server.ts';
import * as exportRoute from '~/pages/api/export.ts';
import { callRoute } from '../../support/route-call.ts';
import { exportFileName } from '~/lib/export/file-name.ts';
import sevenStringFan from '../../../src/lib/boards/demo/seven-string-fan.json';

function post(query: string, body: unknown, type = 'application/json'): Promise<Response> {
  return callRoute(exportRoute.POST, { method: 'POST', path: `/api/export${query}`, headers: { 'content-type': type }, body: typeof body === 'string' ? body : JSON.stringify(body) });
}

describe('POST /api/export', () => {
  it.each([
    ['pdf', 'application/pdf', '%PDF-', 'paper-template.pdf'],
    ['dxf', 'image/vnd.dxf', '999\n', 'slot-paths.dxf'],
    ['svg', 'image/svg+xml; charset=utf-8', '<?xml', 'slot-paths.svg'],
    ['csv', 'text/csv; charset=utf-8', 'fret,string,scale_length', 'fret-table.csv'],
  ])('answers format=%s with %s and an attachment named after the design', async (format, type, start, suffix) => {
    const response = await post(`?format=${format}&paper=a4`, sevenStringFan);
    expect(response.status).toBe(200);
    expect(response.headers.get('content-type')).toBe(type);
    expect(response.headers.get('content-disposition')).toBe(
      `attachment; filename="demo-seven-string-multi-scale-guitar-${suffix}"`,
    );
    const bytes = new Uint8Array(await response.arrayBuffer());
    expect(new TextDecoder().decode(bytes.subarray(0, start.length))).toBe(start);
  });

  it.each([
    ['?format=pdf&paper=a5', 'paper'],
    ['?format=pdf&overlap=-1', 'overlap'],
    ['?format=pdf&overlap=ten', 'overlap'],
    ['?format=pdf&paper=letter&overlap=200', 'overlap'],
    ['?format=pdf&orientation=sideways', 'orientation'],
    ['?format=pdf&mirror=maybe', 'mirror'],
    ['?format=docx', 'format'],
    ['?format=dxf&units=cm', 'units'],
  ])('rejects %s with 400 naming %s', async (query, field) => {
    const response = await post(query, sevenStringFan);
    expect(response.status).toBe(400);
    expect(await response.json()).toMatchObject({ field });
  });

  it('gives the geometry 400 for a design that cannot be laid out, naming the field', async () => {
    const response = await post('?format=pdf', { ...sevenStringFan, scale: { treble: 648, bass: -1 } });
    expect(response.status).toBe(400);
    expect(await response.json()).toMatchObject({ field: 'scale.bass' });
  });

  it('refuses a body that is not JSON (415) or too large (413)', async () => {
    expect((await post('?format=csv', 'name=x', 'text/plain')).status).toBe(415);
    expect((await post('?format=csv', { ...sevenStringFan, pad: 'x'.repeat(70 * 1024) })).status).toBe(413);
  });
});

describe('export file names', () => {
  it('keep only safe ASCII characters from the design name', () => {
    expect(exportFileName('Café "bass"; rm -rf /', 'dxf')).toBe('cafe-bass-rm-rf-slot-paths.dxf');
    expect(exportFileName('../../etc/passwd', 'pdf')).toBe('etc-passwd-paper-template.pdf');
    expect(exportFileName('日本', 'csv')).toBe('design-fret-table.csv');
    expect(exportFileName('x'.repeat(300), 'svg').length).toBeLessThanOrEqual(80 + '-slot-paths.svg'.length);
  });
});

describe('kerfline layout --format ... --out', () => {
  const run = async (args: string[]) => {
    let stdout = '';
    let stderr = '';
    const code = await runKerfline(args, { stdout: (t) => (stdout += t), stderr: (t) => (stderr += t) });
    return { code, stdout, stderr };
  };
  const design = 'src/lib/boards/demo/seven-string-fan.json';

  it('writes a PDF on A4 and a DXF with closed slot outlines to files', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'kerfline-cli-'));
    const pdf = await run(['layout', design, '--format', 'pdf', '--paper', 'a4', '--out', join(dir, 't.pdf')]);
    expect(pdf.code).toBe(0);
    expect(pdf.stdout).toContain('Measure both bars');
    expect(readFileSync(join(dir, 't.pdf')).subarray(0, 5).toString()).toBe('%PDF-');
    const dxf = await run(['layout', design, '--format', 'dxf', '--slots', 'outlines', '--out', join(dir, 't.dxf')]);
    expect(dxf.code).toBe(0);
    expect(readFileSync(join(dir, 't.dxf'), 'utf8')).toContain('POLYLINE');
  });

  it('prints SVG to stdout, and refuses a bad option or a PDF without --out (exit 2)', async () => {
    const svg = await run(['layout', design, '--format', 'svg', '--origin', 'lower-left']);
    expect(svg.code).toBe(0);
    expect(svg.stdout).toMatch(/^<\?xml/);
    const bad = await run(['layout', design, '--format', 'pdf', '--paper', 'b5', '--out', '/tmp/x.pdf']);
    expect(bad.code).toBe(2);
    expect(bad.stderr).toContain('--paper');
    expect((await run(['layout', design, '--format', 'pdf'])).code).toBe(2);
  });

  it('refuses a paper template over the page cap (exit 2) naming --paper, and writes nothing', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'kerfline-cli-'));
    const largest = join(dir, 'largest.json');
    const spacing = { nut: 5000, bridge: 5000 };
    writeFileSync(largest, JSON.stringify({ ...sevenStringFan, strings: 16, frets: 36, scale: { treble: 5000, bass: 5000 }, perpendicularFret: 0, stringSpacing: spacing, radius: { nut: 0 }, markers: [] }));
    const refused = await run(['layout', largest, '--format', 'pdf', '--paper', 'letter', '--overlap', '99.9', '--out', join(dir, 't.pdf')]);
    expect(refused.code).toBe(2);
    expect(refused.stderr).toMatch(/^kerfline: --paper: this paper template would print \d{1,2},\d{3} pages; the most is 200: /);
    expect(existsSync(join(dir, 't.pdf'))).toBe(false);
  });
});
