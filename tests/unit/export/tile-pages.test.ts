import { describe, expect, it } from 'vitest';
import { maxOverlapMm } from '~/lib/export/page-frame.ts';
import { inWindow, planTiles, type Box } from '~/lib/export/tile-pages.ts';
import { validateExportOptions } from '~/lib/schemas/export-options.ts';

/** A board-sized drawing: 700 x 90 mm (invented demo numbers). */
const LONG: Box = { minX: -10, minY: -45, maxX: 690, maxY: 45 };

describe('page tiling', () => {
  it('covers the whole drawing, steps by window minus overlap, and counts pages row by row', () => {
    const plan = planTiles(LONG, { paper: 'a4', orientation: 'portrait', overlap: 15 });
    expect(plan.tiles.length).toBe(plan.rows * plan.columns);
    const first = plan.tiles[0]!;
    const second = plan.tiles[1]!;
    expect(Math.abs(second.x0 - first.x0 - (plan.window.widthMm - 15))).toBeLessThan(1e-9); // mm
    const left = Math.min(...plan.tiles.map((t) => t.x0));
    const right = Math.max(...plan.tiles.map((t) => t.x0)) + plan.window.widthMm;
    expect(left).toBeLessThan(LONG.minX);
    expect(right).toBeGreaterThan(LONG.maxX);
    expect(plan.tiles.map((t) => [t.row, t.column])).toEqual(
      plan.tiles.map((_, i) => [Math.floor(i / plan.columns) + 1, (i % plan.columns) + 1]),
    );
  });

  it('chooses the orientation with fewer pages when auto', () => {
    const auto = planTiles(LONG, { paper: 'letter', orientation: 'auto', overlap: 10 });
    const portrait = planTiles(LONG, { paper: 'letter', orientation: 'portrait', overlap: 10 });
    const landscape = planTiles(LONG, { paper: 'letter', orientation: 'landscape', overlap: 10 });
    expect(auto.tiles.length).toBe(Math.min(portrait.tiles.length, landscape.tiles.length));
  });

  it('places every alignment mark inside at least two page windows', () => {
    const plan = planTiles({ minX: 0, minY: -150, maxX: 600, maxY: 150 }, { paper: 'letter', orientation: 'portrait', overlap: 12 });
    expect(plan.rows).toBeGreaterThan(1);
    for (const mark of plan.marks) {
      expect(plan.tiles.filter((tile) => inWindow(plan, tile, mark)).length).toBeGreaterThanOrEqual(2);
    }
  });

  it('uses one page around the drawing for "fit"', () => {
    const plan = planTiles(LONG, { paper: 'fit', orientation: 'auto', overlap: 10 });
    expect(plan.tiles.length).toBe(1);
    expect(inWindow(plan, plan.tiles[0]!, { x: LONG.minX, y: LONG.minY })).toBe(true);
    expect(inWindow(plan, plan.tiles[0]!, { x: LONG.maxX, y: LONG.maxY })).toBe(true);
  });

  it('rejects an overlap that would leave no new board on each page', () => {
    const limit = maxOverlapMm('letter');
    expect(validateExportOptions({ paper: 'letter', overlap: limit - 1 }).ok).toBe(true);
    const result = validateExportOptions({ paper: 'letter', overlap: limit });
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.issues[0]?.path).toBe('overlap');
  });
});
