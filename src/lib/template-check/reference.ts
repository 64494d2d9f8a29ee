/**
 * Where a template's slots should be: the design's fret positions along each string, taken from
 * the shared geometry (computeLayout and the temperament's r(n)), never recomputed here.
 */
import { computeLayout } from '~/lib/geometry/layout';
import { remainingFraction } from '~/lib/geometry/temperament';
import type { LengthUnit } from '~/lib/format/units';
import type { Design } from '~/lib/schemas/design';

/** One expected slot position on one string, in the design's units. */
export interface ReferenceSlot {
  fret: number;
  /** 1 = treble edge .. N = bass edge. */
  string: number;
  /** The string's scale length L. */
  scaleLength: number;
  /** Design distance from the nut along the string: L * k. */
  fromNut: number;
  /** k = 1 - r(n): the fraction of the scale length at which fret n lies. */
  k: number;
}

export interface CheckReference {
  name: string;
  units: LengthUnit;
  frets: number;
  strings: number;
  /** Whether the outer strings have different scale lengths (per-edge checks make sense). */
  fanned: boolean;
  slots: ReferenceSlot[];
}

/** The expected slot positions of every fret on every string of a validated design. */
export function checkReference(design: Design): CheckReference {
  const layout = computeLayout(design);
  const r = remainingFraction(design.temperament);
  const slots: ReferenceSlot[] = [];
  for (const fret of layout.frets) {
    const k = 1 - r(fret.number);
    for (const point of fret.points) {
      const scaleLength = layout.strings[point.string - 1]?.scaleLength ?? Number.NaN;
      slots.push({ fret: fret.number, string: point.string, scaleLength, fromNut: point.fromNut, k });
    }
  }
  return {
    name: design.name,
    units: design.units,
    frets: design.frets,
    strings: design.strings,
    fanned: design.scale.treble !== design.scale.bass,
    slots,
  };
}

/** The expected slot for `fret` on `string`, if the reference has one. */
export function referenceSlot(reference: CheckReference, fret: number, string: number): ReferenceSlot | undefined {
  return reference.slots.find((slot) => slot.fret === fret && slot.string === string);
}
