import { describe, expect, it } from 'vitest';
import {
  CSS_PX_PER_MM,
  boardToScreen,
  boundsOf,
  fitView,
  oneToOneZoom,
  panBy,
  screenToBoard,
  zoomAt,
  zoomBy,
  type View,
} from '~/components/editor/view-transform.ts';
import { expectNear } from '../../support/expect-near.ts';

const view: View = { zoom: 2.5, originX: 40, originY: 300 };

describe('board to screen mapping', () => {
  it('flips y for display: the bass side (+y) is drawn above the centre line', () => {
    const bass = boardToScreen(view, 0, 10);
    const treble = boardToScreen(view, 0, -10);
    expect(bass.y).toBeLessThan(treble.y);
    expect(boardToScreen(view, 100, 0)).toEqual({ x: 40 + 250, y: 300 });
  });

  it('screenToBoard inverts boardToScreen (within 1e-9 mm)', () => {
    for (const [x, y] of [[0, 0], [648.123, -20.5], [-3.5, 31.5]] as const) {
      const back = screenToBoard(view, boardToScreen(view, x, y));
      expectNear(back.x, x, 1e-9);
      expectNear(back.y, y, 1e-9);
    }
  });
});

describe('zoom to the pointer', () => {
  it('keeps the board point under the pointer fixed (within 1e-9 px)', () => {
    const pointer = { x: 512.5, y: 133.25 };
    const before = screenToBoard(view, pointer);
    const zoomed = zoomAt(view, 7.75, pointer);
    expect(zoomed.zoom).toBe(7.75);
    const after = boardToScreen(zoomed, before.x, before.y);
    expectNear(after.x, pointer.x, 1e-9);
    expectNear(after.y, pointer.y, 1e-9);
  });

  it('zoomBy multiplies the zoom and stops at the limits', () => {
    const anchor = { x: 100, y: 100 };
    expectNear(zoomBy(view, 2, anchor, 'mm').zoom, 5, 1e-12);
    expect(zoomBy(view, 1e9, anchor, 'mm').zoom).toBe(400);
    expect(zoomBy(view, 1e-9, anchor, 'mm').zoom).toBe(0.05);
    // Limits are per millimetre: a design in inches may zoom 25.4 times further in px per unit.
    expectNear(zoomBy(view, 1e9, anchor, 'in').zoom, 400 * 25.4, 1e-9);
  });

  it('panBy moves the origin by the screen distance', () => {
    expect(panBy(view, -15, 4)).toEqual({ zoom: 2.5, originX: 25, originY: 304 });
  });
});

describe('fit board', () => {
  const bounds = { minX: -5, maxX: 695, minY: -35, maxY: 35 };

  it('uses the limiting direction and centres the board in the stage', () => {
    const fitted = fitView(bounds, 1000, 400, 50, 'mm');
    // Width limits: (1000 - 2*50) / 700 px per mm.
    expectNear(fitted.zoom, 900 / 700, 1e-12);
    const topLeft = boardToScreen(fitted, bounds.minX, bounds.maxY);
    const bottomRight = boardToScreen(fitted, bounds.maxX, bounds.minY);
    expectNear(topLeft.x, 50, 1e-9);
    expectNear(bottomRight.x, 950, 1e-9);
    expectNear((topLeft.y + bottomRight.y) / 2, 200, 1e-9);
  });

  it('uses the height when the stage is narrow and tall', () => {
    const fitted = fitView(bounds, 300, 2000, 10, 'mm');
    expectNear(fitted.zoom, 280 / 700, 1e-12);
    const tallBounds = { minX: 0, maxX: 10, minY: -100, maxY: 100 };
    expectNear(fitView(tallBounds, 1000, 400, 50, 'mm').zoom, 300 / 200, 1e-12);
  });

  it('boundsOf finds the smallest box holding the points', () => {
    expect(boundsOf([{ x: 3, y: -2 }, { x: -1, y: 7 }, { x: 0, y: 0 }])).toEqual({ minX: -1, maxX: 3, minY: -2, maxY: 7 });
  });
});

describe('1:1 on screen', () => {
  it('is the calibrated px per mm for mm designs and 25.4 times that for inches (1 in = 25.4 mm exactly)', () => {
    expect(oneToOneZoom(3.9, 'mm')).toBe(3.9);
    expectNear(oneToOneZoom(3.9, 'in'), 99.06, 1e-12);
  });

  it('uses 96 CSS px per inch as the uncalibrated reference (CSS Values and Units Level 3)', () => {
    expectNear(CSS_PX_PER_MM * 25.4, 96, 1e-12);
  });
});
