import { readFile, readdir } from 'node:fs/promises';
import { describe, expect, it } from 'vitest';
import { fretTableCsv } from '~/lib/export/csv.ts';
import { computeLayout } from '~/lib/geometry/layout.ts';
import { DEMO_DESIGNS } from '~/lib/boards/demo/demo-designs.ts';
import { validDesign } from '../../support/design-builders.ts';

const FIXTURES = new URL('../../../fixtures/', import.meta.url);
const DESIGNS = new URL('../../../src/lib/boards/demo/', import.meta.url);
const designFiles = (await readdir(DESIGNS)).filter((f) => f.endsWith('.json')).sort();

/**
 * Golden tables are regression baselines produced by Kerfline itself (see fixtures/README.md),
 * not outside checks: they catch unintended changes to the geometry or the CSV format.
 */
describe('golden fret tables of the demo instruments (regression baselines)', () => {
  it('there is one table per demo design', async () => {
    const tables = (await readdir(new URL('tables/', FIXTURES))).filter((f) => f.endsWith('.csv')).sort();
    expect(tables).toEqual(designFiles.map((f) => f.replace(/\.json$/, '.csv')));
    expect(designFiles).toHaveLength(5);
  });

  it.each(designFiles)('%s regenerates its golden table byte for byte', async (file) => {
    const design = validDesign(JSON.parse(await readFile(new URL(file, DESIGNS), 'utf8')));
    const golden = await readFile(new URL(`tables/${file.replace(/\.json$/, '.csv')}`, FIXTURES), 'utf8');
    expect(fretTableCsv(computeLayout(design))).toBe(golden);
  });
});

describe('demo designs as editor presets', () => {
  it('offers every fixture design, validated, under its file name', () => {
    expect(DEMO_DESIGNS.map((d) => `${d.id}.json`).sort()).toEqual(designFiles);
  });

  it('matches the demo scenario: 7-string 648-686 mm fan at fret 8, 762-813 mm bass, 650 mm, 13.875 in, 17 in', () => {
    const byId = Object.fromEntries(DEMO_DESIGNS.map((d) => [d.id, d.design]));
    expect(byId['seven-string-fan']).toMatchObject({ strings: 7, scale: { treble: 648, bass: 686 }, perpendicularFret: 8, frets: 24 });
    expect(byId['short-scale-bass']).toMatchObject({ strings: 4, scale: { treble: 762, bass: 813 } });
    expect(byId['classical-650']).toMatchObject({ units: 'mm', scale: { treble: 650, bass: 650 }, frets: 19 });
    expect(byId['mandolin']).toMatchObject({ units: 'in', scale: { treble: 13.875, bass: 13.875 } });
    expect(byId['tenor-ukulele']).toMatchObject({ units: 'in', scale: { treble: 17, bass: 17 }, zeroFret: true });
  });

  it('every demo layout computes without warnings', () => {
    for (const { id, design } of DEMO_DESIGNS) {
      expect({ id, warnings: computeLayout(design).warnings }).toEqual({ id, warnings: [] });
    }
  });
});
