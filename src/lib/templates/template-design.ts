/**
 * The design a template is checked against. A template made from a saved design uses that
 * design's revision; an older template with only typed scale lengths gets a stand-in design with
 * parallel outer strings, whose along-string fret positions depend only on the scale lengths.
 * Cutting a fanned strip also needs the slot angles, so there the caller supplies the string
 * spacing and perpendicular fret the typed record lacks (see `fannedStandInDesign`).
 */
import { fromMm } from '~/lib/format/units.ts';
import { validateDesign, type Design, type DesignIssue } from '~/lib/schemas/design.ts';
import type { FanGeometry, TemplateSpec } from '~/lib/schemas/template.ts';

/** Outer string spacing of the stand-in design; it does not change along-string positions. */
const STAND_IN_SPACING_MM = 40;

function twoStringDesign(template: TemplateSpec, fan: FanGeometry) {
  return validateDesign({
    name: template.name,
    units: template.units,
    strings: 2,
    scale: { treble: template.trebleScale, bass: template.bassScale },
    perpendicularFret: fan.perpendicularFret,
    frets: template.frets,
    stringSpacing: { nut: fan.nutSpacing, bridge: fan.saddleSpacing },
    temperament: { kind: 'equal', divisions: 12 },
    slot: { width: template.slotWidth },
    markers: [],
  });
}

/** A 12-tone equal design with two strings: 1 = treble edge, 2 = bass edge. */
export function standInDesign(template: TemplateSpec): Design | null {
  const spacing = fromMm(STAND_IN_SPACING_MM, template.units);
  const validation = twoStringDesign(template, { nutSpacing: spacing, saddleSpacing: spacing, perpendicularFret: 0 });
  return validation.ok ? validation.design : null;
}

/** Where each design field comes from in a FanGeometry request. */
const FAN_FIELD_OF: Record<string, keyof FanGeometry> = {
  'stringSpacing.nut': 'nutSpacing',
  'stringSpacing.bridge': 'saddleSpacing',
  perpendicularFret: 'perpendicularFret',
};

/**
 * The stand-in for a typed fanned template with its real fan: outer string spacing at nut and
 * saddle and the perpendicular fret (lengths in the template's units). Issues name the
 * FanGeometry field at fault where there is one.
 */
export function fannedStandInDesign(template: TemplateSpec, fan: FanGeometry): { ok: true; design: Design } | { ok: false; issues: DesignIssue[] } {
  const validation = twoStringDesign(template, fan);
  if (validation.ok) return validation;
  return { ok: false, issues: validation.issues.map((issue) => ({ path: FAN_FIELD_OF[issue.path] ?? issue.path, message: issue.message })) };
}
