/**
 * Checks of a board's slots against the fret wire chosen for it, in plain words with the numbers.
 * Rules of thumb (common practice): the slot a little wider than the tang body and narrower than
 * the barbs, so the barbs bite; the slot about 0.3 mm deeper than the tang, so the crown seats;
 * and enough wood left under the slot where the board is thinnest (3 mm, from memory).
 */
import { formatLength, fromMm, type LengthUnit } from '~/lib/format/units.ts';
import type { FretWire } from '~/lib/schemas/fret-wire.ts';

/** Extra depth below the tang, mm (common practice). */
export const TANG_CLEARANCE_MM = 0.3;
/** Least wood under a slot before the board is called thin, mm (from memory). */
export const LEAST_WOOD_UNDER_SLOT_MM = 3;

export interface WireCheck {
  /** What was compared: width, depth or wood under the slot. */
  check: 'slot-width' | 'slot-depth' | 'wood-under-slot';
  ok: boolean;
  message: string;
}

export interface SlotFacts {
  units: LengthUnit;
  slotWidth: number;
  slotDepth: number;
  /** Board thickness at the crown, 0 = not given. */
  thickness: number;
  /** How far the top drops below the crown at the lowest slot end (≥ 0), design units. */
  deepestDrop: number;
}

export function wireChecks(facts: SlotFacts, wire: FretWire): WireCheck[] {
  const u = facts.units;
  const len = (value: number) => formatLength(value, u, true);
  const mm = (value: number) => fromMm(value, u);
  const tang = mm(wire.tangWidthMm);
  const barb = mm(wire.barbWidthMm);
  const checks: WireCheck[] = [];
  if (facts.slotWidth <= tang) {
    checks.push({ check: 'slot-width', ok: false, message: `Slot ${len(facts.slotWidth)} is not wider than the tang (${len(tang)}): the wire will split the slot or not go in.` });
  } else if (facts.slotWidth >= barb) {
    checks.push({ check: 'slot-width', ok: false, message: `Slot ${len(facts.slotWidth)} is as wide as the barbs (${len(barb)}) or wider: the barbs will not hold the wire.` });
  } else {
    checks.push({ check: 'slot-width', ok: true, message: `Slot ${len(facts.slotWidth)} lies between the tang (${len(tang)}) and the barbs (${len(barb)}).` });
  }
  const wanted = mm(wire.tangDepthMm + TANG_CLEARANCE_MM);
  checks.push(
    facts.slotDepth + mm(1e-9) >= wanted
      ? { check: 'slot-depth', ok: true, message: `Depth ${len(facts.slotDepth)} clears the tang (${len(mm(wire.tangDepthMm))}) by at least ${len(mm(TANG_CLEARANCE_MM))}.` }
      : { check: 'slot-depth', ok: false, message: `Depth ${len(facts.slotDepth)} is less than the tang depth plus ${len(mm(TANG_CLEARANCE_MM))} (${len(wanted)}): the crown may not seat.` },
  );
  if (facts.thickness > 0) {
    const left = facts.thickness - facts.deepestDrop - facts.slotDepth;
    const least = mm(LEAST_WOOD_UNDER_SLOT_MM);
    checks.push({
      check: 'wood-under-slot',
      ok: left >= least,
      message:
        left >= least
          ? `At least ${len(left)} of wood stays under every slot.`
          : `Only ${len(left)} of wood stays under the slots at the board edges (less than ${len(least)}): a thin board may crack or the slot may break through.`,
    });
  }
  return checks;
}
