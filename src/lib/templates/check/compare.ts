/**
 * Template check: measured slot positions compared with a design. Pure maths on plain data; every
 * length is in the reference's units (convert measurements and tolerance before calling).
 */
import { formatLength, fromMm, type LengthUnit } from '~/lib/format/units.ts';
import { measureLinePhrase, type MeasureLine } from '~/lib/templates/check/measure-lines.ts';
import { referenceAlong, type CheckReference } from '~/lib/templates/check/reference.ts';

/** Default tolerances in mm, common practice: hand-sawn work +/-0.1 mm, CNC +/-0.05 mm. */
export const DEFAULT_TOLERANCE_MM = { hand: 0.1, cnc: 0.05 } as const;
export type WorkMethod = keyof typeof DEFAULT_TOLERANCE_MM;

/** One measured slot: distance from the nut reference the template marks, along the line `along`. */
export interface Measurement {
  fret: number;
  along: MeasureLine;
  fromNut: number;
}

export interface CheckedSlot {
  fret: number;
  along: MeasureLine;
  designFromNut: number;
  measuredFromNut: number;
  /** measured - design: positive means the slot sits too far from the nut. */
  deviation: number;
  /** Pitch error the slot causes; positive = sharp (the stopped string is too short). */
  cents: number;
  withinTolerance: boolean;
}

export interface FitResidual {
  fret: number;
  residual: number;
}

/**
 * Least-squares fit of measured = s * expected (no offset) along one line; `scaleLength` is the
 * equivalent scale of that line, s times its nut-reference-to-saddle length.
 */
export interface ScaleFit {
  factor: number;
  scaleLength: number;
  residuals: FitResidual[];
  maxAbsResidual: number;
}

/** Least-squares fit of measured = s * expected + c: the scale plus a constant shift at the nut. */
export interface OffsetFit extends ScaleFit {
  offset: number;
}

export interface LineFit {
  along: MeasureLine;
  /** The line's own nut-reference-to-saddle length in the design. */
  designScaleLength: number;
  scale: ScaleFit;
  /** Null when the measurements cannot separate scale from offset (fewer than two frets). */
  withOffset: OffsetFit | null;
}

export type Diagnosis =
  | { kind: 'none' }
  /** The slots follow another scale length: the template was made for `scaleLength`. */
  | { kind: 'scale'; along: MeasureLine; scaleLength: number; designScaleLength: number }
  /** The slots follow a scale shifted by a constant: the template moved at the nut. */
  | { kind: 'offset'; along: MeasureLine; offset: number; scaleLength: number }
  /** Individual slots are off; no single scale or shift explains them. */
  | { kind: 'scattered'; along: MeasureLine };

export interface CheckResult {
  units: LengthUnit;
  tolerance: number;
  slots: CheckedSlot[];
  fits: LineFit[];
  passed: boolean;
  failing: number;
  worstDeviation: number;
  worstCents: number;
  diagnoses: Diagnosis[];
  /** One or two sentences a person reads as the verdict. */
  summary: string;
}

export type CheckError = { fret: number; along: MeasureLine; message: string; field: string };

/** Cents: 1200 to the octave (A. J. Ellis, 1885). */
export const CENTS_PER_OCTAVE = 1200;

/**
 * The pitch error of a slot at `measured` instead of `design` on a string of scale `scaleLength`:
 * 1200 * log2((L - d_design) / (L - d_measured)). A stopped string's pitch is inversely
 * proportional to its vibrating length L - d, so a slot too far from the nut plays sharp.
 */
export function centsError(scaleLength: number, design: number, measured: number): number {
  return CENTS_PER_OCTAVE * Math.log2((scaleLength - design) / (scaleLength - measured));
}

/** The default tolerance for a way of working, in `units`. */
export function defaultTolerance(method: WorkMethod, units: LengthUnit): number {
  return fromMm(DEFAULT_TOLERANCE_MM[method], units);
}

interface FitPoint {
  fret: number;
  /** Design distance from the nut reference along the line. */
  expected: number;
  /** Measured distance along the same line. */
  measured: number;
}

/**
 * Least squares for measured = s * expected: minimising sum (m - s e)^2 gives
 * s = sum(m e) / sum(e^2). Along a string (no compensation) e = L k_n, so s L is today's
 * best-fit scale sum(m k) / sum(k^2).
 */
export function fitScale(points: readonly FitPoint[], lineLength: number): ScaleFit {
  let me = 0;
  let ee = 0;
  for (const p of points) {
    me += p.measured * p.expected;
    ee += p.expected * p.expected;
  }
  return withResiduals(points, lineLength, me / ee, 0);
}

/** Ordinary least squares for measured = s * expected + c; null when all expected are equal. */
export function fitScaleAndOffset(points: readonly FitPoint[], lineLength: number): OffsetFit | null {
  const n = points.length;
  let se = 0;
  let sm = 0;
  for (const p of points) {
    se += p.expected;
    sm += p.measured;
  }
  const meanE = se / n;
  const meanM = sm / n;
  let sem = 0;
  let see = 0;
  for (const p of points) {
    sem += (p.expected - meanE) * (p.measured - meanM);
    see += (p.expected - meanE) * (p.expected - meanE);
  }
  if (n < 2 || see === 0) return null;
  const factor = sem / see;
  const offset = meanM - factor * meanE;
  return { ...withResiduals(points, lineLength, factor, offset), offset };
}

function withResiduals(points: readonly FitPoint[], lineLength: number, factor: number, offset: number): ScaleFit {
  const residuals = points.map((p) => ({ fret: p.fret, residual: p.measured - (factor * p.expected + offset) }));
  const maxAbsResidual = residuals.reduce((worst, r) => Math.max(worst, Math.abs(r.residual)), 0);
  return { factor, scaleLength: factor * lineLength, residuals, maxAbsResidual };
}

/**
 * Compares each measurement with the design along the line it was measured along. Returns the
 * errors instead when a measurement names a fret or line the reference does not have, or lies
 * outside the nut-to-saddle run of its line.
 */
export function compareTemplate(
  reference: CheckReference,
  measurements: readonly Measurement[],
  tolerance: number,
): { ok: true; result: CheckResult } | { ok: false; errors: CheckError[] } {
  const errors: CheckError[] = [];
  const slots: CheckedSlot[] = [];
  const byLine = new Map<MeasureLine, FitPoint[]>();
  measurements.forEach((m, index) => {
    const line = referenceAlong(reference, m.along);
    const slot = line?.slots.find((s) => s.fret === m.fret);
    if (!line || !slot) {
      const message = line ? `fret ${m.fret} is not in the design` : `the board has no line "${m.along}"`;
      errors.push({ ...m, field: `measurements.${index}`, message });
      return;
    }
    if (!(m.fromNut > 0 && m.fromNut < line.length)) {
      errors.push({ ...m, field: `measurements.${index}.fromNut`, message: 'must lie between the nut and the saddle' });
      return;
    }
    const deviation = m.fromNut - slot.fromNut;
    slots.push({
      fret: m.fret,
      along: m.along,
      designFromNut: slot.fromNut,
      measuredFromNut: m.fromNut,
      deviation,
      cents: centsError(line.length, slot.fromNut, m.fromNut),
      withinTolerance: Math.abs(deviation) <= tolerance,
    });
    const points = byLine.get(m.along) ?? [];
    points.push({ fret: m.fret, expected: slot.fromNut, measured: m.fromNut });
    byLine.set(m.along, points);
  });
  if (errors.length > 0) return { ok: false, errors };
  if (slots.length === 0) {
    return { ok: false, errors: [{ fret: 0, along: 'centre-line', field: 'measurements', message: 'enter at least one measured slot' }] };
  }

  const order = reference.lines.map((line) => line.along);
  const fits: LineFit[] = [...byLine.entries()]
    .sort(([a], [b]) => order.indexOf(a) - order.indexOf(b))
    .map(([along, points]) => {
      const length = referenceAlong(reference, along)!.length;
      return { along, designScaleLength: length, scale: fitScale(points, length), withOffset: fitScaleAndOffset(points, length) };
    });
  const failing = slots.filter((s) => !s.withinTolerance).length;
  const worst = slots.reduce((a, b) => (Math.abs(b.deviation) > Math.abs(a.deviation) ? b : a));
  const diagnoses = failing === 0 ? [{ kind: 'none' as const }] : fits.filter((fit) => failsOn(slots, fit.along)).map((fit) => diagnose(fit, tolerance));
  const result: CheckResult = {
    units: reference.units,
    tolerance,
    slots,
    fits,
    passed: failing === 0,
    failing,
    worstDeviation: worst.deviation,
    worstCents: worst.cents,
    diagnoses,
    summary: '',
  };
  // Lines are named where it matters: on a fanned board, or when more than one line was measured.
  result.summary = summarise(result, reference.fanned || fits.length > 1 ? reference.strings : null);
  return { ok: true, result };
}

function failsOn(slots: readonly CheckedSlot[], along: MeasureLine): boolean {
  return slots.some((s) => s.along === along && !s.withinTolerance);
}

/**
 * Why one line's slots fail. A scale alone explaining every slot within tolerance means a
 * template made for another scale; otherwise a fit with a constant offset that explains every
 * slot, while the offset itself is outside tolerance, means a template shifted at the nut.
 */
export function diagnose(fit: LineFit, tolerance: number): Diagnosis {
  if (fit.scale.maxAbsResidual <= tolerance) {
    return { kind: 'scale', along: fit.along, scaleLength: fit.scale.scaleLength, designScaleLength: fit.designScaleLength };
  }
  const shifted = fit.withOffset;
  if (shifted && shifted.maxAbsResidual <= tolerance && Math.abs(shifted.offset) > tolerance) {
    return { kind: 'offset', along: fit.along, offset: shifted.offset, scaleLength: shifted.scaleLength };
  }
  return { kind: 'scattered', along: fit.along };
}

function signed(length: number, units: LengthUnit): string {
  const text = formatLength(length, units, true);
  return length > 0 && !text.startsWith('0.00') ? `+${text}` : text;
}

/** " along the treble edge", or nothing when `strings` is null (the line goes without saying). */
function where(along: MeasureLine, strings: number | null): string {
  return strings === null ? '' : ` ${measureLinePhrase(along, strings)}`;
}

function summarise(result: CheckResult, strings: number | null): string {
  const { units, tolerance, slots } = result;
  const band = `±${formatLength(tolerance, units, true)}`;
  if (result.passed) {
    return `Passes: all ${slots.length} slots within ${band} (worst ${signed(result.worstDeviation, units)}).`;
  }
  const lines = [`Fails: ${result.failing} of ${slots.length} slots outside ${band} (worst ${signed(result.worstDeviation, units)}, ${result.worstCents.toFixed(1)} cents).`];
  for (const d of result.diagnoses) {
    if (d.kind === 'scale') {
      lines.push(
        `The slots${where(d.along, strings)} fit a ${formatLength(d.scaleLength, units, true)} scale, not ${formatLength(d.designScaleLength, units, true)}: the template was probably made for that scale.`,
      );
    } else if (d.kind === 'offset') {
      lines.push(
        `The slots${where(d.along, strings)} are shifted by a constant ${signed(d.offset, units)} at the nut (with the shift removed they fit a ${formatLength(d.scaleLength, units, true)} scale).`,
      );
    } else if (d.kind === 'scattered') {
      lines.push(`Individual slots${where(d.along, strings)} are off; no single scale or shift explains them.`);
    }
  }
  return lines.join(' ');
}
