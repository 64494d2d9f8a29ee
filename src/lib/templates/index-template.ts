/**
 * The index template strip of a design: a master board with one slot per fret that a jig's key
 * drops into. Plain data in the design's units and board coordinates (+x from the nut toward the
 * bridge, +y toward the bass side); the DXF and PDF writers only draw it.
 *
 * Each slot runs along its fret line from the strip's open treble edge to the bass string, so
 * the strip stays in one piece along its bass-side band, which carries the engraving. A
 * single-scale strip uses parallel strings, so every slot is square to the strip and lies at
 * exactly L (1 - r(n)) from the nut; a fanned strip follows the design's own string lines and
 * each slot keeps its angle.
 */
import { scaleConventionWords } from '~/lib/format/design-specs.ts';
import { fromMm, formatLength, type LengthUnit } from '~/lib/format/units.ts';
import { computeLayout } from '~/lib/geometry/layout.ts';
import { angleBetweenDeg, distance, intersectLines, type Point, type Segment } from '~/lib/geometry/plane.ts';
import type { Design } from '~/lib/schemas/design.ts';
import { MACHINE_SAFETY_NOTES } from '~/lib/export/safety-note.ts';

/** Strip proportions in mm (our own plain choices), converted for designs in inches. */
export const STRIP_MM = {
  trebleMargin: 5,
  bassBand: 14,
  nutMargin: 15,
  endMargin: 15,
  /** How far a slot runs past the treble edge so the cut clears it. */
  edgeClearance: 1,
  fretNumberHeight: 2.5,
  titleHeight: 3,
} as const;

export interface IndexSlot {
  /** 0 = the nut's registration slot. */
  fret: number;
  /** Where the slot's centre line crosses string 1 (treble) and string N (bass). */
  treble: Point;
  bass: Point;
  /** The slot's centre line as cut: from just outside the treble edge to the bass string. */
  cut: Segment;
  /** Closed outline of the slot, as wide as the jig key, corners in order. */
  outline: Point[];
  /** Angle of the slot from square to the strip's centre line, degrees, positive toward the bridge on the bass side. */
  angleDeg: number;
}

export interface EngravedText {
  text: string;
  /** Baseline from `start` to `end`; the text is centred on it. */
  start: Point;
  end: Point;
  height: number;
}

export interface IndexTemplateStrip {
  name: string;
  units: LengthUnit;
  trebleScale: number;
  bassScale: number;
  keyWidth: number;
  fanned: boolean;
  /** Strip corners: nut treble, far treble, far bass, nut bass. */
  outline: Point[];
  nutSlot: IndexSlot;
  slots: IndexSlot[];
  engraving: EngravedText[];
  /**
   * How the strip registers: along its treble edge (the long straight reference edge) from the
   * nut-end corner to the nut slot's centre line, and the angle between the nut slot and that edge
   * (90° when the nut is square to it).
   */
  registration: { fromEndAlongEdge: number; nutAngleToEdgeDeg: number };
  /** Cautions and instructions that travel with every export of the strip. */
  notes: string[];
}

/** Where the strip's design came from: a saved board revision, or typed scale lengths only. */
export interface StripSource {
  revision: number | null;
  /** That revision's fingerprint (designFingerprint), as its other exports print it. */
  fingerprint?: string | null;
}

/**
 * The strip for `design` with slots as wide as the jig key (`keyWidth`, design units), not the
 * saw kerf. Fret positions come from computeLayout.
 */
export function indexTemplateStrip(design: Design, keyWidth: number, source: StripSource = { revision: null }): IndexTemplateStrip {
  const fanned = design.scale.treble !== design.scale.bass;
  const stripDesign: Design = fanned ? design : { ...design, stringSpacing: { ...design.stringSpacing, bridge: design.stringSpacing.nut } };
  const layout = computeLayout(stripDesign);
  const mm = (value: number) => fromMm(value, design.units);
  const treble = layout.strings[0]!;
  const bass = layout.strings[layout.strings.length - 1]!;

  const down = (p: Point, dy: number): Point => ({ x: p.x, y: p.y + dy });
  const trebleEdge = { start: down(treble.nut, -mm(STRIP_MM.trebleMargin)), end: down(treble.saddle, -mm(STRIP_MM.trebleMargin)) };
  const bassEdge = { start: down(bass.nut, mm(STRIP_MM.bassBand)), end: down(bass.saddle, mm(STRIP_MM.bassBand)) };
  const lastFret = layout.frets[layout.frets.length - 1]!;
  const lastTreble = lastFret.points[0]!;
  const lastBass = lastFret.points[lastFret.points.length - 1]!;
  const along = (a: Point, b: Point, dx: number) => ({ start: { x: a.x + dx, y: a.y }, end: { x: b.x + dx, y: b.y } });
  const nutEnd = along(treble.nut, bass.nut, -mm(STRIP_MM.nutMargin));
  const farEnd = along(lastTreble, lastBass, mm(STRIP_MM.endMargin));
  const cross = (a: Segment, b: Segment) => intersectLines(a.start, a.end, b.start, b.end);
  const outline = [cross(nutEnd, trebleEdge), cross(farEnd, trebleEdge), cross(farEnd, bassEdge), cross(nutEnd, bassEdge)];

  const slotAt = (fret: number, t: Point, b: Point): IndexSlot => {
    const onEdge = intersectLines(t, b, trebleEdge.start, trebleEdge.end);
    const length = Math.hypot(b.x - onEdge.x, b.y - onEdge.y);
    const ux = (b.x - onEdge.x) / length;
    const uy = (b.y - onEdge.y) / length;
    const clearance = mm(STRIP_MM.edgeClearance);
    const start = { x: onEdge.x - ux * clearance, y: onEdge.y - uy * clearance };
    const half = keyWidth / 2;
    // Unit normal (-uy, ux) gives the slot's two long sides.
    const side = (p: Point, s: number): Point => ({ x: p.x - uy * half * s, y: p.y + ux * half * s });
    return {
      fret,
      treble: t,
      bass: b,
      cut: { start, end: b },
      outline: [side(start, 1), side(b, 1), side(b, -1), side(start, -1)],
      angleDeg: (Math.atan2(b.x - t.x, b.y - t.y) * 180) / Math.PI,
    };
  };

  const slots = layout.frets.map((fret) => slotAt(fret.number, fret.points[0]!, fret.points[fret.points.length - 1]!));
  const nutSlot = slotAt(0, treble.nut, bass.nut);
  const scales = fanned
    ? `${formatLength(design.scale.treble, design.units, true)} to ${formatLength(design.scale.bass, design.units, true)}`
    : formatLength(design.scale.treble, design.units, true);

  const numberHeight = mm(STRIP_MM.fretNumberHeight);
  const engraving: EngravedText[] = [nutSlot, ...slots].map((slot) => {
    const label = slot.fret === 0 ? 'NUT' : fanned ? `${slot.fret} ${slot.angleDeg.toFixed(1)}°` : String(slot.fret);
    const base = down(slot.bass, mm(STRIP_MM.bassBand) * 0.45);
    const halfWidth = label.length * numberHeight * 0.3;
    return { text: label, start: { x: base.x - halfWidth, y: base.y }, end: { x: base.x + halfWidth, y: base.y }, height: numberHeight };
  });
  // The title runs along the bass band, parallel to the bass string, between nut and last fret.
  const titleOffset = mm(STRIP_MM.bassBand) * 0.8;
  engraving.push({
    text: `${design.name} · scale ${scales} · key ${formatLength(keyWidth, design.units, true)}`,
    start: down(bass.nut, titleOffset),
    end: down(lastBass, titleOffset),
    height: mm(STRIP_MM.titleHeight),
  });

  const nutOnEdge = intersectLines(treble.nut, bass.nut, trebleEdge.start, trebleEdge.end);
  const registration = {
    fromEndAlongEdge: distance(outline[0]!, nutOnEdge),
    nutAngleToEdgeDeg: angleBetweenDeg({ start: treble.nut, end: bass.nut }, trebleEdge),
  };
  const notes = [
    `Index template for ${design.name}: ${design.frets} frets, scale ${scales} (${scaleConventionWords(design.scaleAlong)}).`,
    source.revision === null ? 'Made from typed scale lengths, not from a saved board revision.' : `Made from revision ${source.revision} of the board${source.fingerprint ? ` (fingerprint ${source.fingerprint})` : ''}.`,
    `Units: ${design.units === 'mm' ? 'millimetres' : 'inches'}. Slot width = jig key width ${formatLength(keyWidth, design.units, true)} (not the saw kerf).`,
    `Registration: the treble edge is the reference edge; the NUT slot's centre line crosses it ${formatLength(registration.fromEndAlongEdge, design.units, true)} from the strip's nut end, measured along that edge.`,
    ...(fanned ? [`The NUT slot meets the treble edge at ${registration.nutAngleToEdgeDeg.toFixed(2)}° (90° would be square to it).`] : []),
    ...(fanned
      ? [
          `Fanned layout: every slot has its own angle (${Math.min(...slots.map((s) => s.angleDeg)).toFixed(2)}° to ${Math.max(...slots.map((s) => s.angleDeg)).toFixed(2)}° from square); the jig must follow each slot's angle.`,
        ]
      : []),
    ...MACHINE_SAFETY_NOTES,
  ];

  return {
    name: design.name,
    units: design.units,
    trebleScale: design.scale.treble,
    bassScale: design.scale.bass,
    keyWidth,
    fanned,
    outline,
    nutSlot,
    slots,
    engraving,
    registration,
    notes,
  };
}
