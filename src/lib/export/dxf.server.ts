/**
 * Slot paths as DXF through makerjs: `$INSUNITS` in the header (1 = inches, 4 = millimetres), one
 * layer per slot-path layer, closed outlines as closed polylines, and a comment (group 999)
 * stating the scale convention, the units and the safety caution.
 * Kept server-side so makerjs stays out of the browser bundle.
 */
import { capitalised, scaleConventionWords } from '~/lib/format/design-specs';
import makerjs from 'makerjs';
import { machineCaution } from './safety-note';
import { SLOT_PATH_LAYERS, type SlotPaths } from './slot-paths';

/**
 * makerjs rounds coordinates to `accuracy` (1e-7 by default); 1e-12 keeps every double the
 * geometry computed to well under a nanometre, so the file is effectively unrounded.
 */
const ACCURACY = 1e-12;

/** AutoCAD colour index per layer, so a CAM program shows the layers apart. */
const LAYER_COLOURS: Record<(typeof SLOT_PATH_LAYERS)[number], number> = {
  outline: makerjs.exporter.colors.white,
  slots: makerjs.exporter.colors.red,
  'centre-line': makerjs.exporter.colors.gray,
  nut: makerjs.exporter.colors.blue,
  saddle: makerjs.exporter.colors.green,
  markers: makerjs.exporter.colors.orange,
};

export function slotPathsDxf(paths: SlotPaths): string {
  const models: Record<string, makerjs.IModel> = {};
  for (const layer of SLOT_PATH_LAYERS) {
    const { lines, closed } = paths.layers[layer];
    const layerPaths: Record<string, makerjs.IPath> = {};
    lines.forEach((segment, index) => {
      layerPaths[`line${index}`] = new makerjs.paths.Line(
        [segment.start.x, segment.start.y],
        [segment.end.x, segment.end.y],
      );
    });
    const layerModels: Record<string, makerjs.IModel> = {};
    closed.forEach((points, index) => {
      layerModels[`closed${index}`] = new makerjs.models.ConnectTheDots(
        true,
        points.map((p) => [p.x, p.y]),
      );
    });
    models[layer] = { layer, paths: layerPaths, models: layerModels };
  }
  const model: makerjs.IModel = {
    units: paths.units === 'mm' ? makerjs.unitType.Millimeter : makerjs.unitType.Inch,
    models,
  };
  const dxf = makerjs.exporter.toDXF(model, {
    accuracy: ACCURACY,
    usePOLYLINE: true,
    // Only genuinely shared corners join into a polyline.
    pointMatchingDistance: ACCURACY,
    layerOptions: Object.fromEntries(SLOT_PATH_LAYERS.map((layer) => [layer, { color: LAYER_COLOURS[layer] }])),
  });
  return `999\n${capitalised(scaleConventionWords(paths.scaleAlong))}.\n999\n${machineCaution(paths.units)}\n${dxf}\n`;
}
