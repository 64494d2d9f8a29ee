/**
 * The index template strip as DXF: $INSUNITS in the header, named layers (OUTLINE, SLOTS, NUT,
 * SLOT_CENTRES, ENGRAVING, NOTES), coordinates unrounded in the design's units, board
 * coordinates (y toward the bass side).
 */
import makerjs from 'makerjs';
import type { Point } from '~/lib/geometry/plane';
import { fromMm } from '~/lib/format/units';
import type { IndexSlot, IndexTemplateStrip } from './index-template';

export const INDEX_TEMPLATE_LAYERS = {
  outline: 'OUTLINE',
  slots: 'SLOTS',
  nut: 'NUT',
  centres: 'SLOT_CENTRES',
  engraving: 'ENGRAVING',
  notes: 'NOTES',
} as const;

const xy = (p: Point): makerjs.IPoint => [p.x, p.y];

function polygon(points: readonly Point[], layer: string): makerjs.IModel {
  const paths: makerjs.IPathMap = {};
  points.forEach((p, i) => {
    paths[`edge${i}`] = new makerjs.paths.Line(xy(p), xy(points[(i + 1) % points.length]!));
  });
  return { layer, paths };
}

function centreLine(slot: IndexSlot): makerjs.IPath {
  return new makerjs.paths.Line(xy(slot.cut.start), xy(slot.cut.end));
}

/** DXF TEXT is plain ASCII here: the degree sign uses the DXF control code %%d. */
function dxfText(text: string): string {
  return text.replace(/°/g, '%%d').replace(/·/g, '-').replace(/[^\x20-\x7e]/g, '?');
}

function caption(text: string, start: Point, end: Point, layer: string): makerjs.IModel {
  return { layer, caption: { text: dxfText(text), anchor: new makerjs.paths.Line(xy(start), xy(end)) } };
}

/** DXF text of the strip. Notes (cautions) are written as text lines below the strip. */
export function indexTemplateDxf(strip: IndexTemplateStrip): string {
  const L = INDEX_TEMPLATE_LAYERS;
  const slots: makerjs.IModelMap = {};
  const centres: makerjs.IPathMap = { nut: centreLine(strip.nutSlot) };
  for (const slot of strip.slots) {
    slots[`fret${slot.fret}`] = polygon(slot.outline, L.slots);
    centres[`fret${slot.fret}`] = centreLine(slot);
  }
  const engraving: makerjs.IModelMap = {};
  strip.engraving.forEach((t, i) => {
    engraving[`text${i}`] = caption(t.text, t.start, t.end, L.engraving);
  });
  const lineHeight = fromMm(6, strip.units);
  const left = Math.min(...strip.outline.map((p) => p.x));
  const top = Math.min(...strip.outline.map((p) => p.y));
  const noteLength = fromMm(200, strip.units);
  const notes: makerjs.IModelMap = {};
  strip.notes.forEach((text, i) => {
    const y = top - lineHeight * (i + 2);
    notes[`note${i}`] = caption(text, { x: left, y }, { x: left + noteLength, y }, L.notes);
  });

  const model: makerjs.IModel = {
    units: strip.units === 'mm' ? makerjs.unitType.Millimeter : makerjs.unitType.Inch,
    models: {
      outline: polygon(strip.outline, L.outline),
      nut: polygon(strip.nutSlot.outline, L.nut),
      slots: { layer: L.slots, models: slots },
      centres: { layer: L.centres, paths: centres },
      engraving: { layer: L.engraving, models: engraving },
      notes: { layer: L.notes, models: notes },
    },
  };
  return makerjs.exporter.toDXF(model, {
    units: model.units!,
    usePOLYLINE: true,
    // A layer is written to the LAYER table only when it has options; ACI colour numbers.
    layerOptions: {
      [L.outline]: { color: makerjs.exporter.colors.white },
      [L.slots]: { color: makerjs.exporter.colors.red },
      [L.nut]: { color: makerjs.exporter.colors.blue },
      [L.centres]: { color: makerjs.exporter.colors.gray },
      [L.engraving]: { color: makerjs.exporter.colors.green },
      [L.notes]: { color: makerjs.exporter.colors.yellow },
    },
    fontSize: fromMm(3, strip.units),
    // Unrounded: DXF readers get the computed doubles back.
    accuracy: 1e-15,
  });
}
