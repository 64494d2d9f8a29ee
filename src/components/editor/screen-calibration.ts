/**
 * Screen calibration for "1:1 on screen": browsers assume 96 CSS px per inch, which real screens
 * rarely match. The user measures a bar drawn 100 mm long (by that assumption) with a ruler and
 * enters what they see; the result is kept in this browser's local storage.
 */
import { CSS_PX_PER_MM } from './view-transform.ts';

/** Nominal length of the calibration bar, in millimetres. */
export const CALIBRATION_BAR_MM = 100;
/** Measured lengths accepted, in millimetres: a bar drawn 100 mm can look 20 to 500 mm long. */
export const MEASURED_BAR_LIMITS_MM = { min: 20, max: 500 } as const;

const STORAGE_KEY = 'kerfline.screenPxPerMm';

/** CSS pixels per real millimetre, given the measured length of the 100 mm bar. */
export function pxPerMmFromMeasurement(measuredMm: number): number {
  return (CALIBRATION_BAR_MM * CSS_PX_PER_MM) / measuredMm;
}

/** A check of what the user typed as the measured bar length; null when it is acceptable. */
export function measurementProblem(measuredMm: number): string | null {
  if (!Number.isFinite(measuredMm)) return 'Enter the measured length as a number of millimetres.';
  const { min, max } = MEASURED_BAR_LIMITS_MM;
  if (measuredMm < min || measuredMm > max) return `Enter a length from ${min} to ${max} mm.`;
  return null;
}

/** The stored calibration, or the browser's nominal 96 px per inch when none is stored. */
export function loadScreenPxPerMm(storage: Pick<Storage, 'getItem'> | undefined): {
  pxPerMm: number;
  calibrated: boolean;
} {
  const stored = Number(storage?.getItem(STORAGE_KEY) ?? Number.NaN);
  if (Number.isFinite(stored) && stored > 0) return { pxPerMm: stored, calibrated: true };
  return { pxPerMm: CSS_PX_PER_MM, calibrated: false };
}

export function saveScreenPxPerMm(storage: Pick<Storage, 'setItem'> | undefined, pxPerMm: number): void {
  storage?.setItem(STORAGE_KEY, String(pxPerMm));
}
