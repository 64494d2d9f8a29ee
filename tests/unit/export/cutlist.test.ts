/**
 * The fret wire cut list: slot length along the line (edge to edge, or stop to stop), the arc of
 * the radiused top over it, wire = arc + 2 × allowance, totals, and the first-fit stock count.
 * Outside check: on a cylinder the arc over a chord c square to the axis is 2R·asin(c/2R) (any
 * geometry handbook). Wire checks follow the rules of thumb in wire-checks.ts (common practice).
 */
import { describe, expect, it } from 'vitest';
import { cutList, cutListCsv, firstFit } from '~/lib/export/cut-list.ts';
import { computeLayout } from '~/lib/geometry/layout.ts';
import { distance } from '~/lib/geometry/plane.ts';
import type { FretWire } from '~/lib/schemas/fret-wire.ts';
import { designOf } from '../../support/design-builders.ts';
import { expectNear } from '../../support/expect-near.ts';

const wire: FretWire = { id: 1, name: 'Test medium', crownWidthMm: 2.5, crownHeightMm: 1.2, tangWidthMm: 0.5, tangDepthMm: 1.5, barbWidthMm: 0.7, stockLengthMm: 610, source: 'test' };

describe('the cut list', () => {
  it('on a flat board: arc = slot length, wire = arc + 2 × 2 mm (the default allowance)', () => {
    const design = designOf();
    const list = cutList(design, computeLayout(design), null);
    expect(list.rows).toHaveLength(24);
    for (const row of list.rows) {
      expect(row.arcLength).toBe(row.slotLength);
      expectNear(row.wireLength, row.slotLength + 4, 1e-12); // mm
    }
    expect(list.stock).toBeNull();
  });

  it('on a single-scale cylinder, each frets arc is 2R·asin(c/2R) over its edge-to-edge slot (geometry handbook)', () => {
    const design = designOf({ radius: { nut: 241.3 } });
    const layout = computeLayout(design);
    const list = cutList(design, layout, null);
    list.rows.forEach((row, i) => {
      const line = layout.frets[i]!.line;
      const c = distance(line.start, line.end);
      expectNear(row.slotLength, c, 1e-12);
      expectNear(row.arcLength, 2 * 241.3 * Math.asin(c / (2 * 241.3)), 1e-9); // mm
    });
  });

  it('stopped slots measure stop to stop; totals are the sums', () => {
    const design = designOf({ slot: { stopped: true, stopDistance: 2 }, radius: { nut: 254, end: 406.4 } });
    const layout = computeLayout(design);
    const list = cutList(design, layout, null);
    list.rows.forEach((row, i) => expectNear(row.slotLength, distance(layout.frets[i]!.slot.start, layout.frets[i]!.slot.end), 1e-12));
    expectNear(list.totals.wireLength, list.rows.reduce((sum, row) => sum + row.wireLength, 0), 1e-9);
  });

  it('counts stock first-fit, longest piece first, and names pieces longer than the stock', () => {
    expect(firstFit([300, 300, 300, 200, 100], 610)).toBe(2);
    expect(firstFit([400, 400, 400], 610)).toBe(3);
    const design = designOf();
    const list = cutList(design, computeLayout(design), null, 50);
    expect(list.tooLong.length).toBe(24);
    expect(cutListCsv(list)).toContain('longer than the stock: fret 1, 2');
  });

  it('checks the wire: slot width between tang and barbs, depth at least tang + 0.3 mm, wood under the slots', () => {
    const good = designOf({ slot: { width: 0.6, depth: 2 }, thickness: 8, radius: { nut: 254 } });
    const checks = cutList(good, computeLayout(good), wire)!.wire!.checks;
    expect(checks.map((c) => [c.check, c.ok])).toEqual([['slot-width', true], ['slot-depth', true], ['wood-under-slot', true]]);
    const bad = designOf({ slot: { width: 0.5, depth: 1.6 }, thickness: 4, radius: { nut: 184.15 } });
    const warnings = cutList(bad, computeLayout(bad), wire)!.wire!.checks;
    expect(warnings.every((c) => !c.ok)).toBe(true);
    expect(warnings[0]!.message).toContain('not wider than the tang');
    const wide = designOf({ slot: { width: 0.75 } });
    expect(cutList(wide, computeLayout(wide), wire).wire!.checks[0]!.message).toContain('barbs will not hold');
  });

  it('writes the CSV header, one row per fret, the totals and the stock line', () => {
    const design = designOf({ frets: 3 });
    const text = cutListCsv(cutList(design, computeLayout(design), wire));
    const lines = text.trimEnd().split('\n');
    expect(lines[0]).toBe('fret,slot_length,arc_length,wire_length');
    expect(lines.slice(1, 4).map((l) => l.split(',')[0])).toEqual(['1', '2', '3']);
    expect(lines[4]).toMatch(/^total,/);
    expect(lines[6]).toBe('# stock pieces of 610 mm: 1 (first-fit, longest piece first)');
  });
});
