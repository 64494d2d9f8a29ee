/**
 * The lines a person measures a template along, with a rule from the nut reference the printed
 * template marks (the zero fret where there is one, else the nut line). The same words name them
 * on the printed paper template, in the check panel, in the measurements CSV and on the command
 * line (`--along`), so a measurement means the same line everywhere.
 */
export type MeasureLine = 'treble-edge' | 'bass-edge' | 'centre-line' | `string-${number}`;

export const EDGE_AND_CENTRE_LINES = ['treble-edge', 'bass-edge', 'centre-line'] as const;

/** Every line of a board with `strings` strings: the two edges, the centre line, then each string. */
export function measureLines(strings: number): MeasureLine[] {
  return [...EDGE_AND_CENTRE_LINES, ...Array.from({ length: strings }, (_, i) => `string-${i + 1}` as const)];
}

/** Reads a line's word (as typed in a CSV or on the command line); null when it names no line of the board. */
export function parseMeasureLine(word: string, strings: number): MeasureLine | null {
  const text = word.trim().toLowerCase();
  if ((EDGE_AND_CENTRE_LINES as readonly string[]).includes(text)) return text as MeasureLine;
  const string = /^string-(\d+)$/.exec(text);
  if (!string) return null;
  const n = Number(string[1]);
  return n >= 1 && n <= strings ? `string-${n}` : null;
}

/** The line in words, as the printed template and the check panel say it. */
export function measureLineLabel(line: MeasureLine, strings: number): string {
  switch (line) {
    case 'treble-edge':
      return 'treble edge';
    case 'bass-edge':
      return 'bass edge';
    case 'centre-line':
      return 'centre line';
    default: {
      const n = Number(line.slice('string-'.length));
      return n === 1 ? 'string 1 (treble)' : n === strings ? `string ${n} (bass)` : `string ${n}`;
    }
  }
}

/** "along the treble edge", "along string 7 (bass)": the line as a phrase in a sentence. */
export function measureLinePhrase(line: MeasureLine, strings: number): string {
  return `along ${line.startsWith('string-') ? '' : 'the '}${measureLineLabel(line, strings)}`;
}
