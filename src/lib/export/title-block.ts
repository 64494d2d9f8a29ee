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

/** Where an export comes from; a saved board passes its revision, fingerprint and shop. */
export interface ExportContext {
  revision?: number | null;
  /** The revision's fingerprint (designFingerprint), shown in History and on the proof page too. */
  fingerprint?: string | null;
  shopName?: string | null;
  /** Set while the board differs from what the client approved (approvalWarning in lib/proofs). */
  approvalWarning?: string | null;
  /** Defaults to now. */
  date?: Date;
  /** The board's fret wire from the shop's list (cut list and cut sheet); absent = none known. */
  wire?: FretWire | null;
}

/** "revision 7 · 4f2a-9c1d-77e0", or "unsaved" for a design that is not a saved board's revision. */
export function revisionWords(context: ExportContext): string {
  if (context.revision == null) return 'unsaved (not a saved board revision)';
  return context.fingerprint ? `revision ${context.revision} · fingerprint ${context.fingerprint}` : `revision ${context.revision}`;
}

/**
 * Where a file comes from, in one line: board, revision and fingerprint, date, units and the
 * scale convention. Written into every export (PDF metadata, DXF and SVG comments, the CSV's
 * optional comment line) so a file found later can be matched to its revision.
 */
export function provenanceLine(design: Pick<Design, 'name' | 'units' | 'scaleAlong'>, context: ExportContext): string {
  const date = (context.date ?? new Date()).toISOString().slice(0, 10);
  const parts = [`Kerfline: ${design.name}`, revisionWords(context), `exported ${date}`, `units ${design.units}`, scaleConventionWords(design.scaleAlong)];
  if (context.approvalWarning) parts.push(`NOT THE APPROVED LAYOUT: ${context.approvalWarning}`);
  return parts.join(' · ');
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
  return [
    design.name,
    `${scale} · units ${design.units}`,
    `(${scaleConventionWords(design.scaleAlong)})`,
    `Perpendicular fret ${design.perpendicularFret} · ${design.frets} frets · ${design.strings} strings`,
    `Temperament ${temperamentName(design)}`,
    slot,
    `${date} · ${revisionWords(context)}`,
    context.shopName ? context.shopName : 'Kerfline',
    ...(context.approvalWarning ? ['NOT THE APPROVED LAYOUT: send a new proof before cutting'] : []),
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
