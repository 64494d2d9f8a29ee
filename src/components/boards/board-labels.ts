/** Words shown for board statuses, instrument types and sorts (our own plain names). */
import { formatLength, fromMm } from '~/lib/format/units.ts';
import type { BoardSort, BoardStatusFilter, BoardSummary, InstrumentType } from '~/lib/schemas/board.ts';

export const STATUS_LABELS: Readonly<Record<BoardStatusFilter, string>> = {
  active: 'All but archived',
  all: 'All, with archived',
  draft: 'Draft',
  shared: 'Shared',
  approved: 'Approved',
  changes_requested: 'Changes requested',
  changed_since_approval: 'Changed since approval',
  archived: 'Archived',
};

export const INSTRUMENT_LABELS: Readonly<Record<InstrumentType, string>> = {
  guitar: 'Guitar',
  classical: 'Classical guitar',
  bass: 'Bass',
  mandolin: 'Mandolin',
  ukulele: 'Ukulele',
  banjo: 'Banjo',
  other: 'Other',
};

export const SORT_LABELS: Readonly<Record<BoardSort, string>> = {
  updated: 'Last changed',
  name: 'Name',
  scale: 'Scale length',
};

/** "648.00 mm" or "648.00–686.00 mm" (multi-scale), in the design's own units. */
export function scaleText(board: Pick<BoardSummary, 'trebleScaleMm' | 'bassScaleMm' | 'units'>): string {
  const treble = formatLength(fromMm(board.trebleScaleMm, board.units), board.units);
  const bass = formatLength(fromMm(board.bassScaleMm, board.units), board.units);
  return treble === bass ? `${treble} ${board.units}` : `${treble}–${bass} ${board.units}`;
}
