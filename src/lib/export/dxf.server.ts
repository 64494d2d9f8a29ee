/**
 * The one DXF writer, through makerjs, for every DXF Kerfline exports (slot paths, the index
 * template): `$INSUNITS` in the header (1 = inches, 4 = millimetres), layers named in lowercase
 * with dashes, open lines as lines, closed shapes as closed polylines, dots as CIRCLEs of their
 * real diameter, engraving as TEXT on its own layer, and everything meant for a person (scale
 * convention, units, cautions, notes) as comments (group 999), never as geometry a CAM program
 * could cut. Kept server-side so makerjs stays out of the browser bundle.
 */
import makerjs from 'makerjs';
import type { LengthUnit } from '~/lib/format/units.ts';
import type { Point, Segment } from '~/lib/geometry/plane.ts';
import { capitalised, scaleConventionWords } from '~/lib/format/design-specs.ts';
import { machineCaution } from './safety-note.ts';
import { SLOT_PATH_LAYERS, type SlotPaths } from './slot-paths.ts';

/**
 * makerjs rounds coordinates to `accuracy` (1e-7 by default); 1e-12 keeps every double the
 * geometry computed to well under a nanometre, so the file is effectively unrounded.
 */
const ACCURACY = 1e-12;

/** AutoCAD colour index per layer name, so a CAM program shows the layers apart. */
const LAYER_COLOURS: Readonly<Record<string, number>> = {
  outline: makerjs.exporter.colors.white,
  slots: makerjs.exporter.colors.red,
  'slot-centres': makerjs.exporter.colors.gray,
  'centre-line': makerjs.exporter.colors.gray,
  nut: makerjs.exporter.colors.blue,
  saddle: makerjs.exporter.colors.green,
  markers: makerjs.exporter.colors.orange,
  engraving: makerjs.exporter.colors.green,
};

/** Text to engrave: centred on the baseline from `start` to `end`. */
export interface DxfText {
  text: string;
  start: Point;
  end: Point;
}

export interface DxfLayer {
  /** Lowercase words joined by dashes. */
  name: string;
  lines?: readonly Segment[];
  /** Closed outlines (the last point joins the first). */
  closed?: readonly (readonly Point[])[];
  /** Dots, `diameter` in the document's units. */
  circles?: readonly { centre: Point; diameter: number }[];
  texts?: readonly DxfText[];
}

export interface DxfDocument {
  units: LengthUnit;
  layers: readonly DxfLayer[];
  /** One 999 comment per entry, at the top of the file. */
  comments: readonly string[];
  /** Height of engraved text, in the document's units. */
  textHeight?: number;
}

export function dxfDocument(doc: DxfDocument): string {
  const models: Record<string, makerjs.IModel> = {};
  for (const layer of doc.layers) {
    const paths: Record<string, makerjs.IPath> = {};
    (layer.lines ?? []).forEach((segment, index) => {
      paths[`line${index}`] = new makerjs.paths.Line(xy(segment.start), xy(segment.end));
    });
    (layer.circles ?? []).forEach((circle, index) => {
      paths[`circle${index}`] = new makerjs.paths.Circle(xy(circle.centre), circle.diameter / 2);
    });
    const layerModels: Record<string, makerjs.IModel> = {};
    (layer.closed ?? []).forEach((points, index) => {
      layerModels[`closed${index}`] = new makerjs.models.ConnectTheDots(true, points.map(xy));
    });
    (layer.texts ?? []).forEach((t, index) => {
      layerModels[`text${index}`] = { layer: layer.name, caption: { text: dxfText(t.text), anchor: new makerjs.paths.Line(xy(t.start), xy(t.end)) } };
    });
    models[layer.name] = { layer: layer.name, paths, models: layerModels };
  }
  const units = doc.units === 'mm' ? makerjs.unitType.Millimeter : makerjs.unitType.Inch;
  const dxf = makerjs.exporter.toDXF(
    { units, models },
    {
      units,
      accuracy: ACCURACY,
      usePOLYLINE: true,
      // Only genuinely shared corners join into a polyline.
      pointMatchingDistance: ACCURACY,
      ...(doc.textHeight === undefined ? {} : { fontSize: doc.textHeight }),
      // A layer is written to the LAYER table only when it has options.
      layerOptions: Object.fromEntries(doc.layers.map((layer) => [layer.name, { color: LAYER_COLOURS[layer.name] ?? makerjs.exporter.colors.white }])),
    },
  );
  return `${doc.comments.map((comment) => `999\n${oneLine(comment)}\n`).join('')}${dxf}\n`;
}

/** Slot paths: one DXF layer per slot-path layer; where it comes from, the scale convention and the caution as comments. */
export function slotPathsDxf(paths: SlotPaths, provenance?: string): string {
  return dxfDocument({
    units: paths.units,
    layers: SLOT_PATH_LAYERS.map((name) => ({ name, ...paths.layers[name] })),
    comments: [
      ...(provenance ? [provenance] : []),
      `${capitalised(scaleConventionWords(paths.scaleAlong))}.`,
      machineCaution(paths.units, 'slot paths'),
    ],
  });
}

const xy = (p: Point): makerjs.IPoint => [p.x, p.y];

/** DXF TEXT is plain ASCII here: the degree sign uses the DXF control code %%d. */
function dxfText(text: string): string {
  return text.replace(/°/g, '%%d').replace(/·/g, '-').replace(/[^\x20-\x7e]/g, '?');
}

/** A 999 comment is one line of plain ASCII text. */
function oneLine(text: string): string {
  return text.replace(/\s+/g, ' ').replace(/°/g, ' deg').replace(/·/g, '-').replace(/[^\x20-\x7e]/g, '?');
}
