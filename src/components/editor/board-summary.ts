/** A plain-text account of the drawing, for screen readers and anyone who prefers words. */
import { formatLength } from '~/lib/format/units.ts';
import type { Layout } from '~/lib/geometry/layout.ts';
import type { Design } from '~/lib/schemas/design.ts';

export function describeBoard(design: Design, layout: Layout): string {
  const show = (length: number) => formatLength(length, layout.units, true);
  const first = layout.strings[0];
  const last = layout.strings[layout.strings.length - 1];
  const scales =
    design.scale.treble === design.scale.bass
      ? `single scale, ${show(design.scale.treble)} on every string`
      : `multi-scale (fanned): string 1 (treble) ${show(first?.scaleLength ?? design.scale.treble)}, ` +
        `string ${design.strings} (bass) ${show(last?.scaleLength ?? design.scale.bass)}`;
  const square =
    design.perpendicularFret === 0 ? 'the nut is square to the centre line' : `fret ${design.perpendicularFret} is square to the centre line`;
  const temperament =
    design.temperament.kind === 'equal'
      ? `${design.temperament.divisions}-tone equal temperament`
      : 'temperament from a Scala file';
  const slots = design.slot.stopped
    ? `slots ${show(design.slot.width)} wide, stopped ${show(design.slot.stopDistance)} short of both edges`
    : `slots ${show(design.slot.width)} wide, cut through both edges`;
  const parts = [
    `Board "${design.name}": ${design.strings} strings, ${scales}`,
    `${design.frets} frets; ${square}`,
    `string spacing ${show(design.stringSpacing.nut)} at the nut and ${show(design.stringSpacing.bridge)} at the saddle`,
    temperament,
    slots,
    design.zeroFret ? 'with a zero fret' : '',
    layout.markers.length > 0 ? `markers at frets ${layout.markers.map((m) => (m.kind === 'double' ? `${m.fret} (double)` : m.fret)).join(', ')}` : 'no markers',
  ];
  return `${parts.filter((part) => part !== '').join('; ')}.`;
}
