/**
 * Template check: measured slot positions compared with a design. Pure maths on plain data; every
 * length is in the reference's units (convert measurements and tolerance before calling).
 */
import { formatLength, fromMm, type LengthUnit } from '~/lib/format/units';
import { referenceSlot, type CheckReference } from './reference';

/** Default tolerances in mm, common practice: hand-sawn work +/-0.1 mm, CNC +/-0.05 mm. */
export const DEFAULT_TOLERANCE_MM = { hand: 0.1, cnc: 0.05 } as const;
export type WorkMethod = keyof typeof DEFAULT_TOLERANCE_MM;

/** One measured slot: distance from the nut along `string` (1 = treble edge). */
export interface Measurement {
  fret: number;
  string: number;
  fromNut: number;
}

export interface CheckedSlot {
  fret: number;
  string: number;
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

/** Least-squares fit of d_n = L k_n (no offset) to one string's measurements. */
export interface ScaleFit {
  scaleLength: number;
  residuals: FitResidual[];
  maxAbsResidual: number;
}

/** Least-squares fit of d_n = L k_n + c: the scale plus a constant shift at the nut. */
export interface OffsetFit extends ScaleFit {
  offset: number;
}

export interface StringFit {
  string: number;
  designScaleLength: number;
  scale: ScaleFit;
  /** Null when the measurements cannot separate scale from offset (fewer than two frets). */
  withOffset: OffsetFit | null;
}

export type Diagnosis =
  | { kind: 'none' }
  /** The slots follow another scale length: the template was made for `scaleLength`. */
  | { kind: 'scale'; string: number; scaleLength: number; designScaleLength: number }
  /** The slots follow a scale shifted by a constant: the template moved at the nut. */
  | { kind: 'offset'; string: number; offset: number; scaleLength: number }
  /** Individual slots are off; no single scale or shift explains them. */
  | { kind: 'scattered'; string: number };

export interface CheckResult {
  units: LengthUnit;
  tolerance: number;
  slots: CheckedSlot[];
  fits: StringFit[];
  passed: boolean;
  failing: number;
  worstDeviation: number;
  worstCents: number;
  diagnoses: Diagnosis[];
  /** One or two sentences a person reads as the verdict. */
  summary: string;
}

export type CheckError = { fret: number; string: number; message: string; field: string };

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

/**
 * Least squares for d_n = L k_n: minimising sum (d_n - L k_n)^2 gives
 * L = sum(d_n k_n) / sum(k_n^2).
 */
export function fitScale(points: readonly { fret: number; k: number; d: number }[]): ScaleFit {
  let dk = 0;
  let kk = 0;
  for (const p of points) {
    dk += p.d * p.k;
    kk += p.k * p.k;
  }
  const scaleLength = dk / kk;
  return withResiduals(points, scaleLength, 0);
}

/** Ordinary least squares for d_n = L k_n + c; null when all k_n are equal. */
export function fitScaleAndOffset(points: readonly { fret: number; k: number; d: number }[]): OffsetFit | null {
  const n = points.length;
  let sk = 0;
  let sd = 0;
  for (const p of points) {
    sk += p.k;
    sd += p.d;
  }
  const meanK = sk / n;
  const meanD = sd / n;
  let skd = 0;
  let skk = 0;
  for (const p of points) {
    skd += (p.k - meanK) * (p.d - meanD);
    skk += (p.k - meanK) * (p.k - meanK);
  }
  if (n < 2 || skk === 0) return null;
  const scaleLength = skd / skk;
  const offset = meanD - scaleLength * meanK;
  return { ...withResiduals(points, scaleLength, offset), offset };
}

function withResiduals(points: readonly { fret: number; k: number; d: number }[], scaleLength: number, offset: number): ScaleFit {
  const residuals = points.map((p) => ({ fret: p.fret, residual: p.d - (scaleLength * p.k + offset) }));
  const maxAbsResidual = residuals.reduce((worst, r) => Math.max(worst, Math.abs(r.residual)), 0);
  return { scaleLength, residuals, maxAbsResidual };
}

/**
 * Compares measurements with the reference. Returns the errors instead when a measurement names a
 * fret or string the reference does not have, or lies outside the string.
 */
export function compareTemplate(
  reference: CheckReference,
  measurements: readonly Measurement[],
  tolerance: number,
): { ok: true; result: CheckResult } | { ok: false; errors: CheckError[] } {
  const errors: CheckError[] = [];
  const slots: CheckedSlot[] = [];
  const byString = new Map<number, { fret: number; k: number; d: number }[]>();
  measurements.forEach((m, index) => {
    const slot = referenceSlot(reference, m.fret, m.string);
    if (!slot) {
      errors.push({ ...m, field: `measurements.${index}`, message: `fret ${m.fret} on string ${m.string} is not in the design` });
      return;
    }
    if (!(m.fromNut > 0 && m.fromNut < slot.scaleLength)) {
      errors.push({ ...m, field: `measurements.${index}.fromNut`, message: 'must lie between the nut and the saddle' });
      return;
    }
    const deviation = m.fromNut - slot.fromNut;
    slots.push({
      fret: m.fret,
      string: m.string,
      designFromNut: slot.fromNut,
      measuredFromNut: m.fromNut,
      deviation,
      cents: centsError(slot.scaleLength, slot.fromNut, m.fromNut),
      withinTolerance: Math.abs(deviation) <= tolerance,
    });
    const points = byString.get(m.string) ?? [];
    points.push({ fret: m.fret, k: slot.k, d: m.fromNut });
    byString.set(m.string, points);
  });
  if (errors.length > 0) return { ok: false, errors };
  if (slots.length === 0) {
    return { ok: false, errors: [{ fret: 0, string: 0, field: 'measurements', message: 'enter at least one measured slot' }] };
  }

  const fits: StringFit[] = [...byString.entries()]
    .sort(([a], [b]) => a - b)
    .map(([string, points]) => ({
      string,
      designScaleLength: referenceSlot(reference, points[0]!.fret, string)!.scaleLength,
      scale: fitScale(points),
      withOffset: fitScaleAndOffset(points),
    }));
  const failing = slots.filter((s) => !s.withinTolerance).length;
  const worst = slots.reduce((a, b) => (Math.abs(b.deviation) > Math.abs(a.deviation) ? b : a));
  const diagnoses = failing === 0 ? [{ kind: 'none' as const }] : fits.filter((fit) => failsOn(slots, fit.string)).map((fit) => diagnose(fit, tolerance));
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
  // Edges are named only on a fanned template, where each edge is checked on its own.
  result.summary = summarise(result, reference.fanned ? reference.strings : 1);
  return { ok: true, result };
}

function failsOn(slots: readonly CheckedSlot[], string: number): boolean {
  return slots.some((s) => s.string === string && !s.withinTolerance);
}

/**
 * Why one string's slots fail. A scale alone explaining every slot within tolerance means a
 * template made for another scale; otherwise a fit with a constant offset that explains every
 * slot, while the offset itself is outside tolerance, means a template shifted at the nut.
 */
export function diagnose(fit: StringFit, tolerance: number): Diagnosis {
  if (fit.scale.maxAbsResidual <= tolerance) {
    return { kind: 'scale', string: fit.string, scaleLength: fit.scale.scaleLength, designScaleLength: fit.designScaleLength };
  }
  const shifted = fit.withOffset;
  if (shifted && shifted.maxAbsResidual <= tolerance && Math.abs(shifted.offset) > tolerance) {
    return { kind: 'offset', string: fit.string, offset: shifted.offset, scaleLength: shifted.scaleLength };
  }
  return { kind: 'scattered', string: fit.string };
}

function signed(length: number, units: LengthUnit): string {
  const text = formatLength(length, units, true);
  return length > 0 && !text.startsWith('0.00') ? `+${text}` : text;
}

function edgeName(string: number, strings: number): string {
  if (strings <= 1) return '';
  return string === 1 ? ' (treble edge)' : string === strings ? ' (bass edge)' : ` (string ${string})`;
}

function summarise(result: CheckResult, strings: number): string {
  const { units, tolerance, slots } = result;
  const band = `±${formatLength(tolerance, units, true)}`;
  if (result.passed) {
    return `Passes: all ${slots.length} slots within ${band} (worst ${signed(result.worstDeviation, units)}).`;
  }
  const lines = [`Fails: ${result.failing} of ${slots.length} slots outside ${band} (worst ${signed(result.worstDeviation, units)}, ${result.worstCents.toFixed(1)} cents).`];
  for (const d of result.diagnoses) {
    if (d.kind === 'scale') {
      lines.push(
        `The slots${edgeName(d.string, strings)} fit a ${formatLength(d.scaleLength, units, true)} scale, not ${formatLength(d.designScaleLength, units, true)}: the template was probably made for that scale.`,
      );
    } else if (d.kind === 'offset') {
      lines.push(
        `The slots${edgeName(d.string, strings)} are shifted by a constant ${signed(d.offset, units)} at the nut (with the shift removed they fit a ${formatLength(d.scaleLength, units, true)} scale).`,
      );
    } else if (d.kind === 'scattered') {
      lines.push(`Individual slots${edgeName(d.string, strings)} are off; no single scale or shift explains them.`);
    }
  }
  return lines.join(' ');
}
