/**
 * The index template strip as DXF through the one DXF writer (dxf.server.ts): layers outline,
 * slots, nut, slot-centres and engraving, coordinates unrounded in the design's units, board
 * coordinates (y toward the bass side). The strip's notes and the machine caution travel as
 * comments (group 999), never as geometry.
 */
import { fromMm } from '~/lib/format/units.ts';
import { dxfDocument } from '~/lib/export/dxf.server.ts';
import type { IndexTemplateStrip } from '~/lib/templates/index-template.ts';
import { machineCaution } from '~/lib/export/safety-note.ts';

export const INDEX_TEMPLATE_LAYERS = {
  outline: 'outline',
  slots: 'slots',
  nut: 'nut',
  centres: 'slot-centres',
  engraving: 'engraving',
} as const;

/** Height of engraved text: 3 mm (our own plain choice). */
const TEXT_HEIGHT_MM = 3;

/** DXF text of the strip. */
export function indexTemplateDxf(strip: IndexTemplateStrip): string {
  const L = INDEX_TEMPLATE_LAYERS;
  return dxfDocument({
    units: strip.units,
    layers: [
      { name: L.outline, closed: [strip.outline] },
      { name: L.slots, closed: strip.slots.map((slot) => slot.outline) },
      { name: L.nut, closed: [strip.nutSlot.outline] },
      { name: L.centres, lines: [strip.nutSlot, ...strip.slots].map((slot) => slot.cut) },
      { name: L.engraving, texts: strip.engraving },
    ],
    comments: [...strip.notes, machineCaution(strip.units, 'index template')],
    textHeight: fromMm(TEXT_HEIGHT_MM, strip.units),
  });
}
