/**
 * Paper sizes for the paper template, in PostScript points (72 pt = 1 in = 25.4 mm exactly,
 * ISO 32000-1). Sizes are given portrait (width < height).
 */
import { MM_PER_INCH, type LengthUnit } from '~/lib/format/units.ts';

export const PT_PER_IN = 72;
/** Points per millimetre: 72 / 25.4. */
export const PT_PER_MM = PT_PER_IN / MM_PER_INCH;

/** Points per one design unit. */
export function ptPerUnit(units: LengthUnit): number {
  return units === 'mm' ? PT_PER_MM : PT_PER_IN;
}

export function mmToPt(mm: number): number {
  return (mm * PT_PER_IN) / MM_PER_INCH;
}

export function ptToMm(pt: number): number {
  return (pt * MM_PER_INCH) / PT_PER_IN;
}

export type SheetPaperName = 'letter' | 'legal' | 'tabloid' | 'a4' | 'a3';
/** `fit`: one sheet sized to the whole drawing, for roll and large-format printers. */
export type PaperName = SheetPaperName | 'fit';

export const PAPER_NAMES = ['letter', 'legal', 'tabloid', 'a4', 'a3', 'fit'] as const satisfies readonly PaperName[];

export interface PaperSize {
  label: string;
  /** Portrait width and height in points. */
  widthPt: number;
  heightPt: number;
}

function inches(label: string, widthIn: number, heightIn: number): PaperSize {
  return { label, widthPt: widthIn * PT_PER_IN, heightPt: heightIn * PT_PER_IN };
}

function millimetres(label: string, widthMm: number, heightMm: number): PaperSize {
  return { label, widthPt: mmToPt(widthMm), heightPt: mmToPt(heightMm) };
}

/** ANSI/ASME Y14.1 (Letter 8.5 x 11 in, Legal 8.5 x 14 in, Tabloid 11 x 17 in); ISO 216 (A4, A3). */
export const PAPER_SIZES: Readonly<Record<SheetPaperName, PaperSize>> = {
  letter: inches('Letter (8.5 × 11 in)', 8.5, 11),
  legal: inches('Legal (8.5 × 14 in)', 8.5, 14),
  tabloid: inches('Tabloid (11 × 17 in)', 11, 17),
  a4: millimetres('A4 (210 × 297 mm)', 210, 297),
  a3: millimetres('A3 (297 × 420 mm)', 297, 420),
};

export const PAPER_LABELS: Readonly<Record<PaperName, string>> = {
  ...Object.fromEntries(Object.entries(PAPER_SIZES).map(([name, size]) => [name, size.label])),
  fit: 'One sheet sized to the board',
} as Record<PaperName, string>;
