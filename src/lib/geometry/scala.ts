/**
 * Parser for the open Scala scale file format (.scl), following its published description:
 * - lines starting with '!' are comments and are skipped anywhere in the file;
 * - the first other line is a free-text description (it may be empty);
 * - the next other line holds the number of pitches;
 * - then one pitch per line. Only the first word of a pitch line counts (the rest is a label).
 *   A value containing '.' is in cents; otherwise it is a ratio `a/b` or a whole number `a`.
 * The unison 1/1 is implied and not listed; the last pitch is the period (usually 2/1, the octave).
 *
 * Pure and browser-safe. Errors are returned as values carrying a 1-based line number.
 */

/** Largest pitch count accepted: generous for real scales, small enough to stay cheap. */
export const SCL_MAX_PITCHES = 1024;

export interface ScalaPitch {
  /** The value exactly as written in the file. */
  text: string;
  /** Size above the unison in cents (1200 cents = 2:1). */
  cents: number;
  /** Frequency ratio to the unison (cents 1200 -> 2). */
  ratio: number;
  /** 1-based line number in the file. */
  line: number;
}

export interface ScalaScale {
  description: string;
  pitches: ScalaPitch[];
  /** The last pitch: the interval after which the scale repeats. */
  period: ScalaPitch;
}

export interface ScalaError {
  /** 1-based line number the problem was found on. */
  line: number;
  message: string;
}

export type SclParseResult = { ok: true; scale: ScalaScale } | { ok: false; error: ScalaError };

const CENTS_PATTERN = /^[+-]?(?:\d+\.\d*|\.\d+)$/;
const RATIO_PATTERN = /^(\d+)(?:\/(\d+))?$/;

/** Parses the text of a .scl file. Accepts \n, \r\n and \r line endings. */
export function parseScl(text: string): SclParseResult {
  if (text.trim() === '') return fail(1, 'the file is empty');
  const lines = text.split(/\r\n|\r|\n/);
  let description: string | null = null;
  let count: number | null = null;
  const pitches: ScalaPitch[] = [];

  for (let index = 0; index < lines.length; index++) {
    const raw = lines[index] ?? '';
    const lineNumber = index + 1;
    if (raw.startsWith('!')) continue;

    if (description === null) {
      description = raw.trim();
      continue;
    }
    const firstWord = raw.trim().split(/\s+/)[0] ?? '';
    if (count === null) {
      if (firstWord === '') continue;
      const parsed = parseCount(firstWord, lineNumber);
      if (!parsed.ok) return parsed;
      count = parsed.count;
      continue;
    }
    if (firstWord === '') continue;
    if (pitches.length === count) {
      return fail(lineNumber, `more pitches than the count line says (${count})`);
    }
    const pitch = parsePitch(firstWord, lineNumber);
    if (!pitch.ok) return pitch;
    pitches.push(pitch.pitch);
  }

  if (description === null) return fail(lines.length, 'missing description line (only comments)');
  if (count === null) return fail(lines.length, 'missing pitch count line after the description');
  const period = pitches[pitches.length - 1];
  if (pitches.length < count || period === undefined) {
    return fail(lines.length, `expected ${count} pitches, found ${pitches.length}`);
  }
  return { ok: true, scale: { description, pitches, period } };
}

function parseCount(
  word: string,
  line: number,
): { ok: true; count: number } | { ok: false; error: ScalaError } {
  if (!/^\d+$/.test(word)) {
    return fail(line, `pitch count must be a whole number, found "${word}"`);
  }
  const count = Number(word);
  if (count < 1 || count > SCL_MAX_PITCHES) {
    return fail(line, `pitch count must be between 1 and ${SCL_MAX_PITCHES}, found ${count}`);
  }
  return { ok: true, count };
}

function parsePitch(
  word: string,
  line: number,
): { ok: true; pitch: ScalaPitch } | { ok: false; error: ScalaError } {
  if (word.includes('.')) {
    if (!CENTS_PATTERN.test(word)) return fail(line, `"${word}" is not a cents value`);
    const cents = Number(word);
    const ratio = 2 ** (cents / 1200);
    if (!Number.isFinite(cents) || !Number.isFinite(ratio) || ratio === 0) {
      return fail(line, `cents value "${word}" is out of range`);
    }
    return { ok: true, pitch: { text: word, cents, ratio, line } };
  }
  if (word.startsWith('-')) return fail(line, `ratio "${word}" is negative`);
  const match = RATIO_PATTERN.exec(word);
  if (match === null) {
    return fail(
      line,
      `"${word}" is not a pitch: write cents with a '.', or a ratio a/b, or a whole number`,
    );
  }
  const numerator = Number(match[1]);
  const denominator = match[2] === undefined ? 1 : Number(match[2]);
  if (numerator === 0) return fail(line, `ratio "${word}" is zero`);
  if (denominator === 0) return fail(line, `ratio "${word}" has a zero denominator`);
  // Very long digit strings overflow to Infinity (or 0 after dividing): refuse them.
  const ratio = numerator / denominator;
  if (!Number.isFinite(ratio) || !(ratio > 0)) return fail(line, `ratio "${word}" is out of range`);
  return { ok: true, pitch: { text: word, cents: 1200 * Math.log2(ratio), ratio, line } };
}

function fail(line: number, message: string): { ok: false; error: ScalaError } {
  return { ok: false, error: { line, message } };
}
