/**
 * `kerfline layout --format gcode|cutlist|cutsheet`: the flags, their defaults in --help, the
 * run-time estimate on stderr, and refusals naming the flag (exit 2).
 */
import { mkdtemp, readFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { parseCommand } from '~/lib/cli/parse-command.server.ts';
import { runKerfline } from '~/lib/cli/run-kerfline.server.ts';

const FAN_FILE = fileURLToPath(new URL('../../../src/lib/boards/demo/seven-string-fan.json', import.meta.url));

async function run(argv: string[]) {
  let stdout = '';
  let stderr = '';
  const code = await runKerfline(argv, { stdout: (t) => (stdout += t), stderr: (t) => (stderr += t) });
  return { code, stdout, stderr };
}

describe('kerfline layout --format gcode', () => {
  it('writes the toolpath, prints the cautions, and the run-time estimate on stderr', async () => {
    const out = join(await mkdtemp(join(tmpdir(), 'kerfline-gcode-')), 'fan.nc');
    const result = await run(['layout', FAN_FILE, '--format', 'gcode', '--dialect', 'grbl', '--feed', '400', '--out', out]);
    expect(result.code).toBe(0);
    expect(result.stdout).toMatch(/^Wrote .*fan\.nc/);
    expect(result.stdout).toContain('dry run first');
    expect(result.stderr).toMatch(/^Estimated run time \d+\.\d min \(cutting \d+\.\d, plunging \d+\.\d, rapids \d+\.\d; \d+ moves/);
    const text = await readFile(out, 'utf8');
    expect(text).toMatch(/^G21 G90 G17 G94$/m);
    expect(text).toMatch(/F400\.0000$/m);
    expect(text).not.toMatch(/^G64/m);
  });

  it('takes every G-code option as a flag and turns kebab-case into the option', () => {
    const parsed = parseCommand(['layout', 'a.json', '--format', 'gcode', '--z-zero', 'edge-at-nut', '--tool-diameter', '0.5', '--plunge-feed', '80', '--safe-z', '8', '--pass-depth', '0.75', '--chord-tolerance', '0.005', '--dry-run', '10', '--spindle', '20000', '--origin', 'lower-left']);
    expect(parsed).toMatchObject({
      ok: true,
      command: { options: { format: 'gcode', zZero: 'edge-at-nut', toolDiameter: 0.5, plungeFeed: 80, safeZ: 8, passDepth: 0.75, chordTolerance: 0.005, dryRun: 10, spindle: 20000, origin: 'lower-left' } },
    });
    expect(parseCommand(['layout', 'a.json', '--format', 'gcode', '--pass-depth=-1'])).toEqual({ ok: false, message: '--pass-depth: must be greater than 0' });
    expect(parseCommand(['layout', 'a.json', '--format', 'gcode', '--dialect', 'fanuc'])).toEqual({ ok: false, message: '--dialect: must be one of: linuxcnc, grbl' });
  });

  it('refuses a tool wider than the slot with exit 2 naming --tool-diameter', async () => {
    const result = await run(['layout', FAN_FILE, '--format', 'gcode', '--tool-diameter', '1']);
    expect(result.code).toBe(2);
    expect(result.stderr).toMatch(/^kerfline: --tool-diameter: must not be wider than the slot/);
    expect(result.stdout).toBe('');
  });

  it('states the defaults in --help', async () => {
    const help = (await run(['--help'])).stdout;
    for (const words of ['--tool-diameter', 'default the slot width', '--feed', '500 mm/min', '--safe-z', '--pass-depth', '--chord-tolerance', '0.01 mm', '--dry-run', '--z-zero', 'crown', '--dialect', 'linuxcnc, grbl', '--stock-length']) {
      expect(help).toContain(words);
    }
  });
});

describe('kerfline layout --format cutlist and cutsheet', () => {
  it('prints the cut list CSV with totals and the stock count for --stock-length', async () => {
    const result = await run(['layout', FAN_FILE, '--format', 'cutlist', '--stock-length', '610']);
    expect(result.code).toBe(0);
    const lines = result.stdout.trimEnd().split('\n');
    expect(lines[0]).toBe('fret,slot_length,arc_length,wire_length');
    expect(lines.filter((line) => /^\d+,/.test(line))).toHaveLength(24);
    expect(lines).toContainEqual(expect.stringMatching(/^total,/));
    expect(lines).toContainEqual(expect.stringMatching(/^# stock pieces of 610 mm: \d+ \(first-fit/));
  });

  it('needs --out for the cut sheet PDF', async () => {
    expect(parseCommand(['layout', 'a.json', '--format', 'cutsheet'])).toEqual({ ok: false, message: 'a cutsheet is a PDF (binary): give --out <file>' });
  });
});
