/**
 * The fret wire cut list: for each slot (zero fret first) its length across the board along its
 * line (edge to edge for a through slot, stop to stop for a stopped one), the length of the
 * radiused top along that line (the wire follows the curve), and the piece of wire to cut: the arc
 * plus the end allowance at both ends. Then the totals and how many stock lengths that takes,
 * filled first-fit with the longest pieces first. Lengths in the design's units; a flat board's
 * arc is the slot length.
 */
import { arcLengthOver, surfaceZ } from '~/lib/geometry/board-radius.ts';
import type { Layout } from '~/lib/geometry/layout.ts';
import { distance } from '~/lib/geometry/plane.ts';
import { fromMm, type LengthUnit } from '~/lib/format/units.ts';
import { fretsWithZero } from '~/lib/picture/board-picture.ts';
import type { Design } from '~/lib/schemas/design.ts';
import type { FretWire } from '~/lib/schemas/fret-wire.ts';
import { wireChecks, type WireCheck } from '~/lib/wire/wire-checks.ts';
import { designSurface } from './gcode-plan.ts';

export interface CutListRow {
  fret: number;
  slotLength: number;
  arcLength: number;
  wireLength: number;
}

export interface CutList {
  units: LengthUnit;
  endAllowance: number;
  rows: CutListRow[];
  totals: { slotLength: number; arcLength: number; wireLength: number };
  /** Stock length used, and pieces of stock the wire takes; null when no stock length is known. */
  stock: { length: number; pieces: number } | null;
  /** Pieces longer than the stock (cannot be cut from it). */
  tooLong: number[];
  /** The chosen wire and its checks, when there is one. */
  wire: { wire: FretWire; checks: WireCheck[] } | null;
}

/** `stockLength` (design units) overrides the wire's own stock length. */
export function cutList(design: Design, layout: Layout, wire: FretWire | null, stockLength?: number): CutList {
  const surface = designSurface(design, layout);
  const allowance = design.wire.endAllowance;
  let deepestDrop = 0;
  const rows = fretsWithZero(layout).map((fret) => {
    const along = design.slot.stopped ? fret.slot : fret.line;
    deepestDrop = Math.max(deepestDrop, -surfaceZ(surface, along.start), -surfaceZ(surface, along.end));
    const arcLength = arcLengthOver(surface, along.start, along.end);
    return { fret: fret.number, slotLength: distance(along.start, along.end), arcLength, wireLength: arcLength + 2 * allowance };
  });
  const sum = (key: keyof Omit<CutListRow, 'fret'>) => rows.reduce((total, row) => total + row[key], 0);
  const length = stockLength ?? (wire ? fromMm(wire.stockLengthMm, design.units) : null);
  const tooLong = length === null ? [] : rows.filter((row) => row.wireLength > length).map((row) => row.fret);
  return {
    units: design.units,
    endAllowance: allowance,
    rows,
    totals: { slotLength: sum('slotLength'), arcLength: sum('arcLength'), wireLength: sum('wireLength') },
    stock: length === null ? null : { length, pieces: firstFit(rows.map((row) => row.wireLength).filter((piece) => piece <= length), length) },
    tooLong,
    wire: wire
      ? { wire, checks: wireChecks({ units: design.units, slotWidth: design.slot.width, slotDepth: design.slot.depth, thickness: design.thickness, deepestDrop }, wire) }
      : null,
  };
}

/** Stock pieces needed: each piece, longest first, goes into the first stock length with room. */
export function firstFit(pieces: readonly number[], stock: number): number {
  const left: number[] = [];
  for (const piece of [...pieces].sort((a, b) => b - a)) {
    const index = left.findIndex((room) => room >= piece);
    if (index === -1) left.push(stock - piece);
    else left[index]! -= piece;
  }
  return left.length;
}

/** `fret,slot_length,arc_length,wire_length`, unrounded, then the totals and the stock count as `#` lines. */
export function cutListCsv(list: CutList): string {
  const lines = ['fret,slot_length,arc_length,wire_length', ...list.rows.map((row) => [row.fret, row.slotLength, row.arcLength, row.wireLength].join(','))];
  lines.push(`total,${list.totals.slotLength},${list.totals.arcLength},${list.totals.wireLength}`);
  lines.push(`# units ${list.units}; wire length = arc length + 2 x ${list.endAllowance} ${list.units} end allowance`);
  lines.push(
    list.stock
      ? `# stock pieces of ${list.stock.length} ${list.units}: ${list.stock.pieces} (first-fit, longest piece first)${list.tooLong.length > 0 ? `; longer than the stock: fret ${list.tooLong.join(', ')}` : ''}`
      : '# stock pieces: no stock length (choose a fret wire or give stockLength)',
  );
  return `${lines.join('\n')}\n`;
}
