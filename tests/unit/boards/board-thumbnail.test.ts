import { describe, expect, it } from 'vitest';
import { boardThumbnailSvg, THUMBNAIL_SIZE } from '~/lib/export/board-thumbnail.ts';
import { computeLayout } from '~/lib/geometry/layout.ts';
import { DEMO_DESIGNS } from '~/lib/boards/demo/demo-designs.ts';

describe('board thumbnail SVG', () => {
  for (const { id, design } of DEMO_DESIGNS) {
    it(`${id}: fixed pixel size, a viewBox around the whole board, one line per fret`, () => {
      const layout = computeLayout(design);
      const svg = boardThumbnailSvg(layout);
      expect(svg).toContain(`width="${THUMBNAIL_SIZE.width}" height="${THUMBNAIL_SIZE.height}"`);
      const [x, y, w, h] = svg.match(/viewBox="([^"]+)"/)![1]!.split(' ').map(Number) as [number, number, number, number];
      for (const p of layout.outline) {
        expect(p.x).toBeGreaterThanOrEqual(x);
        expect(p.x).toBeLessThanOrEqual(x + w);
        // Display y is flipped (bass side up in board terms is down on screen).
        expect(-p.y).toBeGreaterThanOrEqual(y);
        expect(-p.y).toBeLessThanOrEqual(y + h);
      }
      // Frets (and the zero fret), the nut, the two outer strings and the centre line.
      expect(svg.match(/<line /g)).toHaveLength(design.frets + (design.zeroFret ? 1 : 0) + 4);
    });
  }
});
