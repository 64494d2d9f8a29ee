/**
 * The layout answers of POST /api/layout as JSON text: the compact answer (docs/api.md) through a
 * serialiser compiled once from its schema (fast-json-stringify). (The full Layout under `?full=1`
 * is LAYOUT_FORMATS.json.) Every length is a JSON number written as JavaScript writes a double (the shortest
 * text that parses back to the same double), so nothing is rounded.
 */
import fastJson, { type Schema } from 'fast-json-stringify';
import { compactLayout, type CompactLayout } from '~/lib/geometry/compact-layout.ts';
import type { Layout } from '~/lib/geometry/layout.ts';

const number: Schema = { type: 'number' };
const text: Schema = { type: 'string' };
const numbers: Schema = { type: 'array', items: number };
const points: Schema = { type: 'array', items: numbers };

const object = (properties: Record<string, Schema>, extra: { nullable?: boolean } = {}): Schema => ({
  type: 'object',
  properties,
  required: Object.keys(properties),
  additionalProperties: false,
  ...extra,
});

const fretLine = { line: numbers, slot: numbers };

/** The JSON schema of the compact layout answer (CompactLayout); docs/api.md describes each field. */
export const COMPACT_LAYOUT_SCHEMA: Schema = object({
  name: text,
  units: text,
  scaleAlong: text,
  slotWidth: number,
  minimumOverrun: number,
  perpendicularFret: object({ fret: number, x: number }),
  strings: { type: 'array', items: object({ nut: numbers, saddle: numbers, scaleLength: number }) },
  frets: { type: 'array', items: object({ fraction: number, ...fretLine }) },
  zeroFret: object(fretLine, { nullable: true }),
  saddleLine: numbers,
  outline: points,
  centreLine: numbers,
  markers: { type: 'array', items: object({ fret: number, kind: text, dots: points, side: numbers }) },
  dotDiameters: object({ face: number, side: number }),
  warnings: { type: 'array', items: object({ code: text, message: text, fret: { type: 'number', nullable: true } }) },
});

const stringifyCompact: (answer: CompactLayout) => string = fastJson(COMPACT_LAYOUT_SCHEMA);

/** The compact answer's JSON text; `fractions` as for compactLayout. */
export function compactLayoutJson(layout: Layout, fractions: readonly number[]): string {
  return stringifyCompact(compactLayout(layout, fractions));
}

