/**
 * Download file names made from a design's name: ASCII letters, digits, dots, dashes and
 * underscores only, so the name is safe in a Content-Disposition header and on every file system.
 */
import type { ExportFormat } from '~/lib/schemas/export-options';

const SUFFIX: Readonly<Record<ExportFormat, string>> = {
  pdf: 'paper-template.pdf',
  dxf: 'slot-paths.dxf',
  svg: 'slot-paths.svg',
  csv: 'fret-table.csv',
  json: 'layout.json',
};

const MAX_BASE_CHARS = 80;

export function exportFileName(designName: string, format: ExportFormat): string {
  const base = designName
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .replace(/[^A-Za-z0-9._-]+/g, '-')
    .replace(/^[-.]+|[-.]+$/g, '')
    .replace(/-{2,}/g, '-')
    .slice(0, MAX_BASE_CHARS)
    .replace(/[-.]+$/, '');
  return `${base || 'design'}-${SUFFIX[format]}`;
}

/** `attachment; filename="..."` for a name made by exportFileName (already header-safe). */
export function attachmentHeader(fileName: string): string {
  return `attachment; filename="${fileName}"`;
}
