import { parseScl } from '~/lib/geometry/scala.ts';
import type { Design } from '~/lib/schemas/design.ts';
import { CHOICE_ROWS } from '~/lib/schemas/design-fields.ts';
import { formatLength } from './units.ts';

const SCALE_ALONG_WORDS = CHOICE_ROWS.find((row) => row.path === 'scaleAlong')!.optionLabels;

/**
 * How the design's scale lengths are measured, as every output says it: "scale lengths measured
 * along each outer string" or "... along the centre line (square to the nut)".
 */
export function scaleConventionWords(scaleAlong: Design['scaleAlong']): string {
  return `scale lengths measured ${SCALE_ALONG_WORDS[scaleAlong]}`;
}

/** One line of a design's key specifications, in plain words for a client. */
export interface DesignSpec {
  label: string;
  value: string;
}

function temperamentWords(temperament: Design['temperament']): string {
  if (temperament.kind === 'equal') {
    return temperament.divisions === 12
      ? '12-tone equal temperament (standard)'
      : `${temperament.divisions} equal divisions of the octave`;
  }
  const parsed = parseScl(temperament.scl);
  if (!parsed.ok) return 'Custom scale';
  const description = parsed.scale.description.trim();
  return `Custom scale${description ? `: ${description}` : ''} (${parsed.scale.pitches.length} steps)`;
}

function perpendicularWords(fret: number): string {
  if (fret === 0) return 'the nut';
  return Number.isInteger(fret) ? `fret ${fret}` : `between frets ${Math.floor(fret)} and ${Math.ceil(fret)} (${fret})`;
}

/** `text` with its first letter in capitals. */
export function capitalised(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}

/** Scale lengths, strings, frets, perpendicular fret, string spacing and temperament. */
export function designSpecs(design: Design): DesignSpec[] {
  const length = (value: number) => formatLength(value, design.units, true);
  const multiScale = design.scale.treble !== design.scale.bass;
  const specs: DesignSpec[] = [
    {
      label: 'Scale length',
      value: multiScale
        ? `${length(design.scale.treble)} on the treble side to ${length(design.scale.bass)} on the bass side (multi-scale)`
        : length(design.scale.treble),
    },
    { label: 'Measured', value: SCALE_ALONG_WORDS[design.scaleAlong] },
    { label: 'Strings', value: String(design.strings) },
    { label: 'Frets', value: String(design.frets) },
  ];
  if (multiScale) specs.push({ label: 'Perpendicular fret', value: `Square to the centre line at ${perpendicularWords(design.perpendicularFret)}` });
  specs.push(
    {
      label: 'String spacing',
      value: `${length(design.stringSpacing.nut)} at the nut, ${length(design.stringSpacing.bridge)} at the bridge (outer strings, centre to centre)`,
    },
    { label: 'Temperament', value: temperamentWords(design.temperament) },
  );
  return specs;
}
