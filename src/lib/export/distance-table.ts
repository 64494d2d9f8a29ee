/**
 * The table of fret distances a paper template can carry on its last page: for every fret, the
 * distance from the nut reference the template marks (the zero fret where there is one, else the
 * nut line) along the treble edge, the bass edge and the centre line, the same lines and numbers the
 * Template check compares with (templates/check/reference.ts).
 */
import type { Layout } from '~/lib/geometry/layout.ts';
import { referenceLine } from '~/lib/templates/check/reference.ts';

export interface DistanceRow {
  fret: number;
  trebleEdge: number;
  bassEdge: number;
  centreLine: number;
}

/** One row per fret, lengths in the layout's units. */
export function distanceRows(layout: Layout): DistanceRow[] {
  const [treble, bass, centre] = (['treble-edge', 'bass-edge', 'centre-line'] as const).map((along) => referenceLine(layout, along).slots);
  return treble!.map((slot, i) => ({
    fret: slot.fret,
    trebleEdge: slot.fromNut,
    bassEdge: bass![i]!.fromNut,
    centreLine: centre![i]!.fromNut,
  }));
}
