import { formatLength, type LengthUnit } from '~/lib/format/units.ts';
import { distance, type Segment } from './plane.ts';

export type LayoutWarningCode =
  | 'frets-closer-than-slot'
  | 'slot-too-short'
  | 'nut-past-first-fret'
  | 'board-end-past-saddle';

/** Something the builder should look at; the layout is still computed. */
export interface LayoutWarning {
  code: LayoutWarningCode;
  message: string;
  /** The fret concerned, or null for the whole board. */
  fret: number | null;
}

export interface ClosestGap {
  gap: number;
  string: number;
}

export interface WarningInput {
  units: LengthUnit;
  slotWidth: number;
  zeroFret: boolean;
  stoppedSlots: boolean;
  stopDistance: number;
  nutCompensation: number;
  /** For every fret 1..F, its smallest distance from the previous fret and on which string. */
  closestGaps: readonly ClosestGap[];
  frets: readonly { number: number; line: Segment }[];
  /** x where the board end and the drawn saddle line cross the centre line. */
  boardEndCentreX: number;
  saddleCentreX: number;
}

/** Warnings for frets that cannot be slotted as drawn and for an implausible board. */
export function layoutWarnings(input: WarningInput): LayoutWarning[] {
  const show = (length: number) => formatLength(length, input.units, true);
  const warnings: LayoutWarning[] = [];
  input.closestGaps.forEach(({ gap, string }, index) => {
    const fret = index + 1;
    // Fret 1 follows the nut, which is not a slot, unless a zero fret sits there.
    if (fret === 1 && !input.zeroFret) return;
    if (gap < input.slotWidth) {
      warnings.push({
        code: 'frets-closer-than-slot',
        fret,
        message:
          `Frets ${fret - 1} and ${fret} are ${show(gap)} apart on string ${string}, ` +
          `less than the slot width ${show(input.slotWidth)}.`,
      });
    }
  });
  if (input.stoppedSlots) {
    for (const { number, line } of input.frets) {
      if (distance(line.start, line.end) <= 2 * input.stopDistance) {
        warnings.push({
          code: 'slot-too-short',
          fret: number,
          message: `Fret ${number} is too short for slots stopped ${show(input.stopDistance)} from each edge.`,
        });
      }
    }
  }
  const firstGap = input.closestGaps[0];
  if (firstGap && input.nutCompensation >= firstGap.gap) {
    warnings.push({
      code: 'nut-past-first-fret',
      fret: 1,
      message: `The nut compensation ${show(input.nutCompensation)} reaches fret 1.`,
    });
  }
  if (input.boardEndCentreX >= input.saddleCentreX) {
    warnings.push({
      code: 'board-end-past-saddle',
      fret: null,
      message: 'The board end reaches the saddle line.',
    });
  }
  return warnings;
}
