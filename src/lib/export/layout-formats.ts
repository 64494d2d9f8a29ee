import type { Layout } from '~/lib/geometry/layout.ts';
import { fretTableCsv } from './csv.ts';

/**
 * The text forms of a computed layout, shared by POST /api/layout and the command line. Every
 * export format, these included, goes through exportDesign (export-design.server.ts).
 */
export interface LayoutFormat {
  contentType: string;
  /** File name extension, without the dot. */
  extension: string;
  render(layout: Layout): string;
}

export const LAYOUT_FORMATS = {
  json: {
    contentType: 'application/json; charset=utf-8',
    extension: 'json',
    render: (layout) => JSON.stringify(layout),
  },
  csv: {
    contentType: 'text/csv; charset=utf-8',
    extension: 'csv',
    render: fretTableCsv,
  },
} satisfies Record<string, LayoutFormat>;

export type LayoutFormatName = keyof typeof LAYOUT_FORMATS;

export function isLayoutFormatName(name: string): name is LayoutFormatName {
  return Object.hasOwn(LAYOUT_FORMATS, name);
}
