/**
 * The one place where Kerfline converts lengths between millimetres and inches and rounds them
 * for display. Geometry is computed in the design's own units; conversion happens at the edges.
 */

/** Exact: 1 in = 25.4 mm (international yard and pound agreement, 1959). */
export const MM_PER_INCH = 25.4;

export type LengthUnit = 'mm' | 'in';

export const LENGTH_UNITS: readonly LengthUnit[] = ['mm', 'in'];

/** Millimetres to inches. */
export function mmToIn(mm: number): number {
  return mm / MM_PER_INCH;
}

/** Inches to millimetres. */
export function inToMm(inches: number): number {
  return inches * MM_PER_INCH;
}

/** Converts a length given in millimetres into `units` (identity for mm). */
export function fromMm(mm: number, units: LengthUnit): number {
  return units === 'mm' ? mm : mmToIn(mm);
}

/** Converts a length given in `units` into millimetres (identity for mm). */
export function toMm(length: number, units: LengthUnit): number {
  return units === 'mm' ? length : inToMm(length);
}

/** Converts a length between two units. */
export function convertLength(length: number, from: LengthUnit, to: LengthUnit): number {
  return from === to ? length : fromMm(toMm(length, from), to);
}

/** Decimal places shown on screen: 0.01 mm or 0.001 in. */
export const DISPLAY_DECIMALS: Readonly<Record<LengthUnit, number>> = { mm: 2, in: 3 };

/**
 * Formats a length for display, rounded to 0.01 mm or 0.001 in. Exports never use this:
 * they carry unrounded numbers.
 */
export function formatLength(length: number, units: LengthUnit, withUnit = false): string {
  const text = roundForDisplay(length, units).toFixed(DISPLAY_DECIMALS[units]);
  return withUnit ? `${text} ${units}` : text;
}

/** Rounds a length to the display step of its unit (0.01 mm or 0.001 in). */
export function roundForDisplay(length: number, units: LengthUnit): number {
  const factor = 10 ** DISPLAY_DECIMALS[units];
  const rounded = Math.round(length * factor) / factor;
  // Avoid showing "-0.00".
  return Object.is(rounded, -0) ? 0 : rounded;
}
