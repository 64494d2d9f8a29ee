import { parseScl, type ScalaScale } from './scala.ts';

/** How the octave (or a Scala scale's period) is divided into frets. */
export type Temperament = { kind: 'equal'; divisions: number } | { kind: 'scala'; scl: string };

/**
 * r(n): the fraction of a string's scale length that still vibrates when the string is stopped at
 * fret n, i.e. the inverse of the frequency ratio of step n to the open string. r(0) = 1.
 * Fret n therefore lies at the fraction 1 - r(n) of the string from its nut end.
 */
export type RemainingFraction = (fret: number) => number;

/**
 * Equal temperament of `divisions` steps per octave: r(n) = 2^(-n/divisions).
 * `fret` may be any real number (used for a fractional perpendicular fret); this is the exact
 * exponential, not an interpolation between neighbouring frets.
 */
export function equalRemainingFraction(divisions: number): RemainingFraction {
  return (fret) => 2 ** (-fret / divisions);
}

/**
 * Scala scale: step n < pitch count uses pitch n; steps past the last pitch repeat the scale,
 * multiplied by the period (the last pitch) once per repetition. Only whole steps exist.
 * @throws RangeError for a negative or fractional step (a validated design never asks for one).
 */
export function scalaRemainingFraction(scale: ScalaScale): RemainingFraction {
  const count = scale.pitches.length;
  const ratios = [1, ...scale.pitches.map((pitch) => pitch.ratio)];
  const period = scale.period.ratio;
  return (fret) => {
    if (!Number.isInteger(fret) || fret < 0) {
      throw new RangeError(`a Scala scale has only whole, non-negative steps (asked for ${fret})`);
    }
    const repetitions = Math.floor(fret / count);
    const step = fret - repetitions * count;
    return 1 / ((ratios[step] ?? 1) * period ** repetitions);
  };
}

/**
 * r(n) for a temperament as stored in a design.
 * @throws Error when a Scala text does not parse (validated designs always parse).
 */
export function remainingFraction(temperament: Temperament): RemainingFraction {
  if (temperament.kind === 'equal') return equalRemainingFraction(temperament.divisions);
  const parsed = parseScl(temperament.scl);
  if (!parsed.ok) {
    throw new Error(`invalid Scala text, line ${parsed.error.line}: ${parsed.error.message}`);
  }
  return scalaRemainingFraction(parsed.scale);
}
