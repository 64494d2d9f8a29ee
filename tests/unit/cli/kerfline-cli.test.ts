import { execFile } from 'node:child_process';
import { mkdtemp, readFile, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { promisify } from 'node:util';
import { describe, expect, it } from 'vitest';
import { parseCommand } from '~/lib/cli/parse-command.server.ts';
import { runKerfline } from '~/lib/cli/run-kerfline.server.ts';
import { computeLayout } from '~/lib/geometry/layout.ts';
import { validateDesign } from '~/lib/schemas/design.ts';
import { expectNear } from '../../support/expect-near.ts';

const ROOT = fileURLToPath(new URL('../../../', import.meta.url));
const FAN_FILE = join(ROOT, 'src/lib/boards/demo/seven-string-fan.json');

async function run(argv: string[]) {
  let stdout = '';
  let stderr = '';
  const code = await runKerfline(argv, { stdout: (t) => (stdout += t), stderr: (t) => (stderr += t) });
  return { code, stdout, stderr };
}

describe('kerfline command line', () => {
  it('parses layout commands and rejects unknown ones', () => {
    expect(parseCommand(['layout', 'a.json'])).toMatchObject({ ok: true, command: { kind: 'layout', designPath: 'a.json', options: { format: 'csv' } } });
    expect(parseCommand(['layout', 'a.json', '--format', 'json'])).toMatchObject({ ok: true, command: { kind: 'layout', designPath: 'a.json', options: { format: 'json' } } });
    expect(parseCommand(['layout', 'a.json', '--format', 'gif'])).toMatchObject({ ok: false });
    expect(parseCommand(['draw'])).toEqual({ ok: false, message: 'unknown command "draw"' });
    expect(parseCommand(['layout'])).toEqual({ ok: false, message: 'layout needs a design file' });
    expect(parseCommand(['--help'])).toEqual({ ok: true, command: { kind: 'help' } });
    // The paper template stops at the board end unless --to-saddle asks for the full length.
    expect(parseCommand(['layout', 'a.json', '--format', 'pdf', '--out', 't.pdf'])).toMatchObject({ ok: true, command: { options: { toSaddle: false } } });
    expect(parseCommand(['layout', 'a.json', '--format', 'pdf', '--out', 't.pdf', '--to-saddle'])).toMatchObject({ ok: true, command: { options: { toSaddle: true } } });
  });

  it('prints the JSON layout with --format json', async () => {
    const result = await run(['layout', FAN_FILE, '--format', 'json']);
    expect(result.code).toBe(0);
    const layout = JSON.parse(result.stdout) as { frets: unknown[]; strings: unknown[] };
    expect([layout.frets.length, layout.strings.length]).toEqual([24, 7]);
  });

  it('exits 1 with the validation message for a bad design, and for a missing file', async () => {
    const dir = await mkdtemp(join(tmpdir(), 'kerfline-cli-'));
    const bad = join(dir, 'bad.json');
    await writeFile(bad, JSON.stringify({ name: 'Bad', units: 'mm', strings: 6, scale: { treble: 0, bass: 650 } }));
    const result = await run(['layout', bad]);
    expect(result.code).toBe(1);
    expect(result.stdout).toBe('');
    expect(result.stderr).toContain('scale.treble: must be greater than 0');
    expect(result.stderr).toContain('frets: Required');
    const missing = await run(['layout', join(dir, 'nope.json')]);
    expect(missing.code).toBe(1);
    expect(missing.stderr).toContain('cannot read design');
  });

  it('npm run kerfline prints the exact header and correct rows for the fanned 7-string demo', async () => {
    const { stdout } = await promisify(execFile)('npm', ['run', '--silent', 'kerfline', '--', 'layout', FAN_FILE, '--format', 'csv'], { cwd: ROOT });
    const lines = stdout.split('\n');
    expect(lines[0]).toBe('fret,string,scale_length,from_nut,from_previous,x,y');
    expect(lines).toHaveLength(1 + 24 * 7 + 1);
    for (const line of lines.slice(1, -1)) {
      const [fret, string, scaleLength, fromNut] = line.split(',').map(Number) as [number, number, number, number];
      if (string === 1) expect(scaleLength).toBe(648);
      if (string === 7) expect(scaleLength).toBe(686);
      // Varieschi & Gower, Am. J. Phys. 78 (2010): d(n) = L (1 - 2^(-n/12)) along each string.
      expectNear(fromNut, scaleLength * (1 - 2 ** (-fret / 12)), 1e-9); // mm
    }
  });
});

describe('kerfline check', () => {
  async function files(csv: string) {
    const dir = await mkdtemp(join(tmpdir(), 'kerfline-check-'));
    const path = join(dir, 'measured.csv');
    await writeFile(path, csv);
    return path;
  }

  /** The fan's own slot positions along the treble edge, from the layout's fret lines (edge to edge). */
  async function trebleEdgeCsv(shift = 0): Promise<string> {
    const validation = validateDesign(JSON.parse(await readFile(FAN_FILE, 'utf8')));
    if (!validation.ok) throw new Error('demo design invalid');
    const layout = computeLayout(validation.design);
    const nut = layout.nutLine.start;
    const rows = layout.frets.map((f) => `${f.number};${String(Math.hypot(f.line.start.x - nut.x, f.line.start.y - nut.y) + shift).replace('.', ',')}`);
    return `fret;from_nut\n${rows.join('\n')}\n`;
  }

  it('exits 0 and prints the JSON verdict for the fan measured along its treble edge (semicolons, decimal commas)', async () => {
    const result = await run(['check', FAN_FILE, await files(await trebleEdgeCsv()), '--along', 'treble-edge', '--format', 'json']);
    expect(result.stderr).toBe('');
    expect(result.code).toBe(0);
    const verdict = JSON.parse(result.stdout) as { passed: boolean; worstDeviation: number; slots: { fret: number; along: string; expected: number; measured: number; deviation: number }[] };
    expect(verdict.passed).toBe(true);
    expect(Math.abs(verdict.worstDeviation)).toBeLessThan(1e-6); // mm
    expect(verdict.slots).toHaveLength(24);
    expect(Object.keys(verdict.slots[0]!)).toEqual(expect.arrayContaining(['fret', 'along', 'expected', 'measured', 'deviation']));
    expect(verdict.slots.every((s) => s.along === 'treble-edge')).toBe(true);
  });

  it('exits 1 when a slot is outside the tolerance (text output), and --tolerance widens it in design units', async () => {
    const path = await files(await trebleEdgeCsv(0.3));
    const failed = await run(['check', FAN_FILE, path, '--along', 'treble-edge']);
    expect(failed.code).toBe(1);
    expect(failed.stdout).toMatch(/^Fails: 24 of 24 slots outside ±0\.10 mm/);
    const wide = await run(['check', FAN_FILE, path, '--along', 'treble-edge', '--tolerance', '0.5']);
    expect(wide.code).toBe(0);
    expect(wide.stdout).toMatch(/^Passes: all 24 slots within ±0\.50 mm/);
  });

  it('the default line is the centre line; measured along the edge and checked along the centre line a fan fails', async () => {
    const result = await run(['check', FAN_FILE, await files(await trebleEdgeCsv()), '--format', 'json']);
    expect(result.code).toBe(1);
    expect((JSON.parse(result.stdout) as { slots: { along: string }[] }).slots[0]!.along).toBe('centre-line');
  });

  it('exits 2 with the file, line number and reason for bad input', async () => {
    const bad = await run(['check', FAN_FILE, await files('fret,along,from_nut\n1,treble-edge,36\n2,side,70\n')]);
    expect(bad.code).toBe(2);
    expect(bad.stdout).toBe('');
    expect(bad.stderr).toMatch(/measured\.csv:3: along "side" is not a line of this board/);
    const pastSaddle = await run(['check', FAN_FILE, await files('fret,from_nut\n1,36\n2,900\n')]);
    expect(pastSaddle.code).toBe(2);
    expect(pastSaddle.stderr).toMatch(/measured\.csv:3: fret 2 along centre-line: must lie between the nut and the saddle/);
    expect((await run(['check', FAN_FILE, await files('1,36\n'), '--along', 'string-8'])).stderr).toMatch(/--along: the board has no line "string-8"/);
    expect((await run(['check', FAN_FILE, await files('1,36\n'), '--along', 'edge'])).code).toBe(2);
    expect((await run(['check', FAN_FILE, await files('1,36\n'), '--tolerance', '-1'])).code).toBe(2);
    expect((await run(['check', FAN_FILE])).code).toBe(2);
    expect((await run(['check', FAN_FILE, join(tmpdir(), 'no-such-file.csv')])).stderr).toMatch(/cannot read measurements/);
    expect((await run(['layout', FAN_FILE, '--along', 'centre-line'])).stderr).toMatch(/--along belongs to the check command/);
  });
});
