/**
 * The keyboard's place in the drawing: one fret on one string. Left/Right step along the frets,
 * Up/Down across the strings (up the screen is the bass side, so Up is the next string toward the
 * bass). Pure: the drawing keeps the cursor and announces `cursorWords`.
 */
import { formatLength } from '~/lib/format/units.ts';
import type { Layout } from '~/lib/geometry/layout.ts';

export interface FretCursor {
  fret: number;
  /** 1 = treble. */
  string: number;
}

export type CursorKey = 'ArrowLeft' | 'ArrowRight' | 'ArrowUp' | 'ArrowDown';

export function isCursorKey(key: string): key is CursorKey {
  return key === 'ArrowLeft' || key === 'ArrowRight' || key === 'ArrowUp' || key === 'ArrowDown';
}

/** The cursor after `key`; from nowhere, any key lands on fret `start` (the picked fret, or 1) on string 1. */
export function stepCursor(layout: Layout, cursor: FretCursor | null, key: CursorKey, start: number | null = null): FretCursor | null {
  const first = layout.frets[0]?.number;
  const last = layout.frets.at(-1)?.number;
  if (first === undefined || last === undefined) return null;
  const clamp = (value: number, low: number, high: number) => Math.min(high, Math.max(low, value));
  if (!cursor) return { fret: clamp(start ?? first, first, last), string: 1 };
  const strings = layout.strings.length;
  const move: Record<CursorKey, FretCursor> = {
    ArrowLeft: { fret: cursor.fret - 1, string: cursor.string },
    ArrowRight: { fret: cursor.fret + 1, string: cursor.string },
    ArrowUp: { fret: cursor.fret, string: cursor.string + 1 },
    ArrowDown: { fret: cursor.fret, string: cursor.string - 1 },
  };
  const next = move[key];
  return { fret: clamp(next.fret, first, last), string: clamp(next.string, 1, strings) };
}

/** Where the cursor is, as the readout announces it, in the design's units. */
export function cursorWords(layout: Layout, cursor: FretCursor): string {
  const point = layout.frets.find((fret) => fret.number === cursor.fret)?.points.find((p) => p.string === cursor.string);
  if (!point) return '';
  const previous = cursor.fret === layout.frets[0]?.number ? 'the nut' : `fret ${cursor.fret - 1}`;
  const length = (value: number) => formatLength(value, layout.units, true);
  return `Fret ${cursor.fret}, string ${cursor.string}: ${length(point.fromNut)} from the nut, ${length(point.fromPrevious)} from ${previous}`;
}

/** The cursor's point on the board (board units), for the marker drawn there. */
export function cursorPoint(layout: Layout, cursor: FretCursor): { x: number; y: number } | null {
  const point = layout.frets.find((fret) => fret.number === cursor.fret)?.points.find((p) => p.string === cursor.string);
  return point ? { x: point.x, y: point.y } : null;
}
