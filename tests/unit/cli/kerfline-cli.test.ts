import { execFile } from 'node:child_process';
import { mkdtemp, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { promisify } from 'node:util';
import { describe, expect, it } from 'vitest';
import { parseCommand } from '~/lib/cli/parse-command.server.ts';
import { runKerfline } from '~/lib/cli/run-kerfline.server';
import { expectNear } from '../../support/expect-near';

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
