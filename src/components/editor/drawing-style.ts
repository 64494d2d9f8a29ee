/**
 * How the board is drawn: screen widths in CSS px (constant at any zoom) and colours from the
 * Kerfline palette (tailwind.config.mjs). Line kinds also differ by width and dash, and carry
 * labels, so nothing is told by colour alone.
 */
export const DRAWING_COLOURS = {
  board: '#f1e6d2',
  boardEdge: '#1f2328',
  fret: '#4b5259',
  fretStopped: '#8a9096',
  slot: '#1f2328',
  string: '#2f5d50',
  centre: '#7a3b2e',
  nutSaddle: '#1f2328',
  reference: '#8a9096',
  marker: '#4b5259',
  label: '#1f2328',
  highlight: '#2f5d50',
  measure: '#7a3b2e',
  outOfDate: '#8a9096',
} as const;

export const LINE_WIDTHS_PX = {
  outline: 1.5,
  fret: 1,
  slot: 2,
  string: 1,
  centre: 1,
  nutSaddle: 3,
  reference: 1,
  highlight: 5,
  measure: 1.5,
} as const;

export const DASHES_PX = {
  centre: [12, 4, 2, 4],
  reference: [4, 4],
  perpendicular: [6, 3],
} as const;

export const LABEL_FONT = { family: '"JetBrains Mono", ui-monospace, monospace', sizePx: 11 } as const;

/** Screen distance the pointer may be from a fret line (readouts) or a crossing (measure snap). */
export const PICK_REACH_PX = 8;
export const SNAP_REACH_PX = 12;
