import { describe, expect, it } from 'vitest';
import { DEMO_DESIGNS } from '~/lib/boards/demo/demo-designs.ts';
import { computeLayout, type Layout } from '~/lib/geometry/layout.ts';
import type { Design } from '~/lib/schemas/design.ts';
import { checkGridSchema } from '~/lib/schemas/template.ts';
import { defaultTolerance, type CheckResult, type Measurement } from '~/lib/templates/check/compare.ts';
import type { MeasureLine } from '~/lib/templates/check/measure-lines.ts';
import { checkReference, referenceAlong } from '~/lib/templates/check/reference.ts';
import { runCheck } from '~/lib/templates/check/run-check.ts';
import { readSavedResult } from '~/lib/templates/check/saved-result.ts';
import { validDesign } from '../../support/design-builders.ts';
import { expectNear } from '../../support/expect-near.ts';

const FANS = ['seven-string-fan', 'short-scale-bass'].map((id) => DEMO_DESIGNS.find((d) => d.id === id)!);

/**
 * Along each edge from the nut corner: the fret lines run edge to edge and the edge starts where
 * the nut line meets it, so a rule along the edge reads the straight distance between the ends.
 */
function edgeReadings(layout: Layout, edge: 'treble' | 'bass'): number[] {
  const nut = edge === 'treble' ? layout.nutLine.start : layout.nutLine.end;
  return layout.frets.map((fret) => {
    const end = edge === 'treble' ? fret.line.start : fret.line.end;
    return Math.hypot(end.x - nut.x, end.y - nut.y);
  });
}

function entered(layout: Layout, lines: { treble: MeasureLine; bass: MeasureLine }): Measurement[] {
  return (['treble', 'bass'] as const).flatMap((edge) =>
    edgeReadings(layout, edge).map((fromNut, i) => ({ fret: i + 1, along: lines[edge], fromNut })),
  );
}

function check(design: Design, measurements: Measurement[]): CheckResult {
  const outcome = runCheck(design, { units: design.units, tolerance: defaultTolerance('hand', design.units), measurements });
  if (!outcome.ok) throw new Error(JSON.stringify(outcome));
  return outcome.result;
}

const worstOn = (result: CheckResult, along: MeasureLine) => Math.max(...result.slots.filter((s) => s.along === along).map((s) => Math.abs(s.deviation)));

describe('a fanned template measured along its edges', () => {
  for (const { id, design } of FANS) {
    it(`${id}: compared along the outer strings (the old check) it fails by over 1 mm; compared along the edges it passes (< 1e-6 mm)`, () => {
      const layout = computeLayout(design);
      const old = check(design, entered(layout, { treble: 'string-1', bass: `string-${design.strings}` }));
      expect(old.passed).toBe(false);
      expect(Math.abs(old.worstDeviation)).toBeGreaterThan(1); // mm
      const now = check(design, entered(layout, { treble: 'treble-edge', bass: 'bass-edge' }));
      expect(now.passed).toBe(true);
      expect(worstOn(now, 'treble-edge')).toBeLessThan(1e-6); // mm
      expect(worstOn(now, 'bass-edge')).toBeLessThan(1e-6); // mm
    });
  }

  it('a fan template made for scales 1 % longer: the fit along each edge recovers about 1.01 x that edge\'s own length', () => {
    const design = FANS[0]!.design;
    const long = validDesign({ ...design, scale: { treble: design.scale.treble * 1.01, bass: design.scale.bass * 1.01 } });
    const result = check(design, entered(computeLayout(long), { treble: 'treble-edge', bass: 'bass-edge' }));
    expect(result.passed).toBe(false);
    const reference = checkReference(design);
    for (const along of ['treble-edge', 'bass-edge'] as const) {
      const fit = result.fits.find((f) => f.along === along)!;
      expect(fit.designScaleLength).toBe(referenceAlong(reference, along)!.length);
      // Only the scales grew, not the string spacing, so the edges lengthen by slightly less than 1 %.
      expectNear(fit.scale.scaleLength / fit.designScaleLength, 1.01, 0.0005); // ratio
      expect(result.diagnoses).toContainEqual(expect.objectContaining({ kind: 'scale', along }));
    }
    expect(result.summary).toMatch(/The slots along the treble edge fit a/);
  });

  it('along a string the equivalent scale is the string\'s scale, as the old per-string fit gave', () => {
    const design = FANS[0]!.design;
    const line = referenceAlong(checkReference(design), 'string-1')!;
    expectNear(line.length, design.scale.treble, 1e-9); // mm: the fan's scales are along its strings
  });
});

describe('older check requests and saved checks that name string: N', () => {
  it('the grid schema reads string: N as along string-N, takes along as given, and refuses both at once', () => {
    const parse = (measurements: unknown[]) => checkGridSchema.safeParse({ units: 'mm', tolerance: 0.1, measurements });
    expect(parse([{ fret: 1, string: 7, fromNut: 38 }]).data?.measurements).toEqual([{ fret: 1, along: 'string-7', fromNut: 38 }]);
    expect(parse([{ fret: 1, fromNut: 38 }]).data?.measurements).toEqual([{ fret: 1, along: 'string-1', fromNut: 38 }]);
    expect(parse([{ fret: 1, along: 'bass-edge', fromNut: 38 }]).data?.measurements).toEqual([{ fret: 1, along: 'bass-edge', fromNut: 38 }]);
    expect(parse([{ fret: 1, along: 'bass-edge', string: 2, fromNut: 38 }]).success).toBe(false);
    expect(parse([{ fret: 1, along: 'side', fromNut: 38 }]).error?.issues[0]?.path).toEqual(['measurements', 0, 'along']);
  });

  it('a saved result with string fields reads as along string-N with nothing else changed', () => {
    const saved = {
      units: 'mm',
      tolerance: 0.1,
      slots: [{ fret: 1, string: 7, designFromNut: 38.5, measuredFromNut: 38.6, deviation: 0.1, cents: 0.3, withinTolerance: true }],
      fits: [{ string: 7, designScaleLength: 686, scale: { scaleLength: 687, residuals: [], maxAbsResidual: 0 }, withOffset: null }],
      passed: true,
      failing: 0,
      worstDeviation: 0.1,
      worstCents: 0.3,
      diagnoses: [{ kind: 'scattered', string: 7 }],
      summary: 'Passes',
    };
    const read = readSavedResult(saved);
    expect(read.slots[0]).toEqual({ fret: 1, along: 'string-7', designFromNut: 38.5, measuredFromNut: 38.6, deviation: 0.1, cents: 0.3, withinTolerance: true });
    expect(read.fits[0]).toMatchObject({ along: 'string-7', designScaleLength: 686, scale: { scaleLength: 687, factor: 687 / 686 } });
    expect(read.diagnoses).toEqual([{ kind: 'scattered', along: 'string-7' }]);
    expect(read.summary).toBe('Passes');
  });
});
