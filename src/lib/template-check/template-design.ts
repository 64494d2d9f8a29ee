/**
 * The design a template is checked against. A template made from a saved design uses that
 * design's revision; an older template with only typed scale lengths gets a stand-in design with
 * parallel outer strings, whose along-string fret positions depend only on the scale lengths.
 */
import { fromMm } from '~/lib/format/units';
import { validateDesign, type Design } from '~/lib/schemas/design';
import type { TemplateSpec } from '~/lib/schemas/template';

/** Outer string spacing of the stand-in design; it does not change along-string positions. */
const STAND_IN_SPACING_MM = 40;

/** A 12-tone equal design with two strings: 1 = treble edge, 2 = bass edge. */
export function standInDesign(template: TemplateSpec): Design | null {
  const spacing = fromMm(STAND_IN_SPACING_MM, template.units);
  const validation = validateDesign({
    name: template.name,
    units: template.units,
    strings: 2,
    scale: { treble: template.trebleScale, bass: template.bassScale },
    perpendicularFret: 0,
    frets: template.frets,
    stringSpacing: { nut: spacing, bridge: spacing },
    temperament: { kind: 'equal', divisions: 12 },
    slot: { width: template.slotWidth },
    markers: [],
  });
  return validation.ok ? validation.design : null;
}
