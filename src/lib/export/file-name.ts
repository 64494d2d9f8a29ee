/**
 * The one place download file names are made, for every export (paper template, slot paths,
 * slot toolpath, cut list, cut sheet, fret table, layout JSON, board file, index template, template label), from the name of the
 * design, board or template: accented letters folded to ASCII, then ASCII letters, digits, dots,
 * dashes and underscores only, so the name is safe in a Content-Disposition header and on every
 * file system, and the same file gets the same name wherever it is downloaded from.
 */
import type { ExportFormat } from '~/lib/schemas/export-options.ts';

const SUFFIX: Readonly<Record<ExportFormat, string>> = {
  pdf: 'paper-template.pdf',
  dxf: 'slot-paths.dxf',
  svg: 'slot-paths.svg',
  csv: 'fret-table.csv',
  json: 'layout.json',
  gcode: 'slot-toolpath.nc',
  cutlist: 'cut-list.csv',
  cutsheet: 'cut-sheet.pdf',
};

/** What is downloaded: a design export by its format, or one of the other files. */
export type DownloadFile =
  | ExportFormat
  | { kind: 'board-file'; revision: number }
  | { kind: 'index-template'; templateId: number; format: 'pdf' | 'dxf' }
  | { kind: 'label'; templateId: number; size: string };

const MAX_BASE_CHARS = 80;

/**
 * `<slug>-r<revision>-<kind>.<ext>` for a saved board's revision (`<slug>-<kind>.<ext>` for an
 * unsaved design); templates add their shelf number after the slug.
 */
export function exportFileName(name: string, file: DownloadFile, revision?: number | null): string {
  const base = safeName(name).toLowerCase() || 'design';
  const slug = revision == null ? base : `${base}-r${revision}`;
  if (typeof file === 'string') return `${slug}-${SUFFIX[file]}`;
  switch (file.kind) {
    case 'board-file':
      return `${base}-r${file.revision}-board.json`;
    case 'index-template':
      return `${base}-${file.templateId}${revision == null ? '' : `-r${revision}`}-index-template.${file.format}`;
    case 'label':
      return `${base}-${file.templateId}${revision == null ? '' : `-r${revision}`}-label-${safeName(file.size).toLowerCase()}.pdf`;
  }
}

function safeName(name: string): string {
  return name
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .replace(/[^A-Za-z0-9._-]+/g, '-')
    .replace(/^[-.]+|[-.]+$/g, '')
    .replace(/-{2,}/g, '-')
    .slice(0, MAX_BASE_CHARS)
    .replace(/[-.]+$/, '');
}

/** `attachment; filename="..."` for a name made by exportFileName (already header-safe). */
export function attachmentHeader(fileName: string): string {
  return `attachment; filename="${fileName}"`;
}
