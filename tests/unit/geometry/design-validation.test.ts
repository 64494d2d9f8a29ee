import { describe, expect, it } from 'vitest';
import { validateDesign } from '~/lib/schemas/design.ts';
import { designInput, validDesign, withField } from '../../support/design-builders.ts';

function issuePaths(input: unknown): string[] {
  const validation = validateDesign(input);
  if (validation.ok) expect.fail('expected the design to be rejected');
  for (const issue of validation.issues) expect(issue.message.length).toBeGreaterThan(0);
  return validation.issues.map((issue) => issue.path);
}

describe('validateDesign rejects bad input, naming the field', () => {
  it.each([
    ['name', ''],
    ['name', 'x'.repeat(121)],
    ['name', 42],
    ['units', 'cm'],
    ['strings', '6'],
    ['strings', 1],
    ['strings', 10_000],
    ['strings', 6.5],
    ['scale', undefined],
    ['scale.treble', undefined],
    ['scale.treble', -650],
    ['scale.treble', 0],
    ['scale.treble', 'NaN'],
    ['scale.treble', Number.NaN],
    ['scale.treble', Number.POSITIVE_INFINITY],
    ['scale.bass', 1e308],
    ['scale.bass', 5000.001],
    ['stringSpacing.nut', 0],
    ['stringSpacing.bridge', -1],
    ['perpendicularFret', -1],
    ['perpendicularFret', 24.5],
    ['perpendicularFret', null],
    ['frets', 0],
    ['frets', 37],
    ['frets', 12.5],
    ['temperament', 'equal'],
    ['temperament.kind', 'meantone'],
    ['temperament.divisions', 0],
    ['colour', 'red'],
    ['slot.width', 0],
    ['compensation.nut', 100],
    ['endExtension', -5],
    ['overhang.nut', -0.1],
    ['zeroFret', 'yes'],
    ['markers', [{ fret: 25, kind: 'single' }]],
  ])('%s = %j', (path, value) => {
    const paths = issuePaths(withField(path, value));
    // Each rejection points at the field itself (or, for lists, one of its entries).
    expect(paths.some((p) => p === path || p.startsWith(`${path}.`))).toBe(true);
  });

  it.each([null, 'design', 42, [], true])('a body that is not an object (%j) is rejected as a whole', (input) => {
    expect(issuePaths(input)).toEqual(['design']);
  });

  it('names both scales when the strings spread wider than they are long', () => {
    const paths = issuePaths(designInput({ scale: { treble: 600, bass: 700 }, stringSpacing: { nut: 10, bridge: 1500 } }));
    expect(paths).toEqual(['scale.treble', 'scale.bass']);
  });

  it('names a repeated marker fret', () => {
    const markers = [{ fret: 12, kind: 'double' as const }, { fret: 12, kind: 'single' as const }];
    expect(issuePaths(designInput({ markers }))).toEqual(['markers.1.fret']);
  });

  it('limits lengths in inches by the same 5000 mm and says both units', () => {
    const validation = validateDesign(designInput({ units: 'in', scale: { treble: 200, bass: 25.5 }, stringSpacing: { nut: 1.6, bridge: 2.2 } }));
    expect(!validation.ok && validation.issues).toEqual([
      { path: 'scale.treble', message: 'must be at most 196.850 in (5000 mm)' },
    ]);
  });
});

describe('validateDesign fills defaults', () => {
  it('in mm, with the common-practice markers cut at the last fret', () => {
    const design = validDesign(designInput({ frets: 20 }));
    expect(design.slot).toEqual({ width: 0.6, overrun: 0, depth: 3, stopped: false, stopDistance: 2 });
    expect(design.compensation).toEqual({ nut: 0, saddleTreble: 0, saddleBass: 0 });
    expect(design.zeroFret).toBe(false);
    expect(design.markers.map((m) => m.fret)).toEqual([3, 5, 7, 9, 12, 15, 17, 19]);
  });

  it('converted to inches for a design in inches', () => {
    const design = validDesign(designInput({ units: 'in', scale: { treble: 25.5, bass: 25.5 }, stringSpacing: { nut: 1.4, bridge: 2.1 } }));
    expect(design.slot.width).toBe(0.6 / 25.4);
    expect(design.overhang.nut).toBe(3.5 / 25.4);
    expect(design.zeroFretNutGap).toBe(5 / 25.4);
  });

  it('keeps given values and trims the name', () => {
    const design = validDesign(designInput({ name: '  Build 12  ', slot: { width: 0.5, stopped: true }, markers: [] }));
    expect(design.name).toBe('Build 12');
    expect(design.slot).toEqual({ width: 0.5, overrun: 0, depth: 3, stopped: true, stopDistance: 2 });
    expect(design.markers).toEqual([]);
  });
});
