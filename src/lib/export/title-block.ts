/**
 * The title block printed on every page of the paper template: what the design is, so a print
 * found on the bench months later can be matched to its design and revision.
 */
import { scaleConventionWords } from '~/lib/format/design-specs.ts';
import { formatLength } from '~/lib/format/units.ts';
import { parseScl } from '~/lib/geometry/scala.ts';
import type { Design } from '~/lib/schemas/design.ts';
import type { FretWire } from '~/lib/schemas/fret-wire.ts';
import type { ExportOptions } from '~/lib/schemas/export-options.ts';

/** Where an export comes from; a saved design passes its revision and shop. */
export interface ExportContext {
  revision?: number | null;
  shopName?: string | null;
  /** Defaults to now. */
  date?: Date;
  /** The board's fret wire from the shop's list (cut list and cut sheet); absent = none known. */
  wire?: FretWire | null;
}

export function titleBlockLines(design: Design, options: Pick<ExportOptions, 'mirror'>, context: ExportContext): string[] {
  const length = (value: number) => formatLength(value, design.units, true);
  const scale =
    design.scale.treble === design.scale.bass
      ? `Scale ${length(design.scale.treble)}`
      : `Scale ${length(design.scale.treble)} treble / ${length(design.scale.bass)} bass`;
  const slot = design.slot.stopped
    ? `Slot ${length(design.slot.width)}, stopped ${length(design.slot.stopDistance)} from edges`
    : `Slot ${length(design.slot.width)}, through`;
  const date = (context.date ?? new Date()).toISOString().slice(0, 10);
  const revision = context.revision == null ? 'unsaved' : `revision ${context.revision}`;
  return [
    design.name,
    `${scale} · units ${design.units}`,
    `(${scaleConventionWords(design.scaleAlong)})`,
    `Perpendicular fret ${design.perpendicularFret} · ${design.frets} frets · ${design.strings} strings`,
    `Temperament ${temperamentName(design)}`,
    slot,
    `${date} · ${revision}`,
    context.shopName ? context.shopName : 'Kerfline',
    ...(options.mirror ? ['MIRRORED for gluing face-down'] : []),
  ];
}

function temperamentName(design: Design): string {
  const { temperament } = design;
  if (temperament.kind === 'equal') return `${temperament.divisions}-tone equal`;
  const parsed = parseScl(temperament.scl);
  const description = parsed.ok ? parsed.scale.description : '';
  return description ? `Scala: ${description}` : 'Scala scale';
}
