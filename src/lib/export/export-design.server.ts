/**
 * One entry point for every export of a validated design: the API routes (unsaved designs here,
 * saved designs in the Boards area) and the command line call this.
 */
import { computeLayout } from '~/lib/geometry/layout.ts';
import type { Design } from '~/lib/schemas/design.ts';
import type { ExportFormat, ExportOptions } from '~/lib/schemas/export-options.ts';
import { cutList, cutListCsv } from './cut-list.ts';
import { cutSheetPdf } from './cut-sheet-pdf.server.ts';
import { designFingerprint } from '~/lib/boards/fingerprint.server.ts';
import { slotPathsDxf } from './dxf.server.ts';
import { gcodeText } from './gcode.ts';
import { designToolpath } from './gcode-checks.ts';
import { exportFileName } from './file-name.ts';
import { LAYOUT_FORMATS } from './layout-formats.ts';
import { paperTemplatePdf } from './pdf.server.ts';
import { slotPaths } from './slot-paths.ts';
import { slotPathsSvg } from './svg.ts';
import { provenanceLine, type ExportContext } from './title-block.ts';

export type { ExportContext } from './title-block.ts';

export interface ExportFile {
  bytes: Uint8Array;
  contentType: string;
  /** Sanitised, made from the design name; safe for Content-Disposition. */
  filename: string;
}

export const EXPORT_CONTENT_TYPES: Readonly<Record<ExportFormat, string>> = {
  pdf: 'application/pdf',
  // IANA registers DXF as image/vnd.dxf.
  dxf: 'image/vnd.dxf',
  svg: 'image/svg+xml; charset=utf-8',
  csv: LAYOUT_FORMATS.csv.contentType,
  json: LAYOUT_FORMATS.json.contentType,
  gcode: 'text/plain; charset=utf-8',
  cutlist: LAYOUT_FORMATS.csv.contentType,
  cutsheet: 'application/pdf',
};

/**
 * Builds the file for `options.format`; every length comes from computeLayout. G-code options are
 * checked first by the callers (exportOptionIssues); one that fails here is a programming error.
 */
export async function exportDesign(
  design: Design,
  options: ExportOptions,
  context: ExportContext = {},
): Promise<ExportFile> {
  const layout = computeLayout(design);
  const text = new TextEncoder();
  let bytes: Uint8Array;
  switch (options.format) {
    case 'pdf':
      bytes = (await paperTemplatePdf(design, layout, options, context)).bytes;
      break;
    case 'dxf':
      bytes = text.encode(slotPathsDxf(slotPaths(layout, options), provenanceLine(design, context)));
      break;
    case 'svg':
      bytes = text.encode(slotPathsSvg(slotPaths(layout, options), provenanceLine(design, context)));
      break;
    case 'csv': {
      const comment = options.sourceComment ? `# ${provenanceLine(design, context)}\n` : '';
      bytes = text.encode(`${comment}${LAYOUT_FORMATS.csv.render(layout)}`);
      break;
    }
    case 'json':
      bytes = text.encode(`${LAYOUT_FORMATS.json.render(layout)}\n`);
      break;
    case 'gcode': {
      const planned = designToolpath(design, layout, options);
      if (!planned.ok) throw new Error(`G-code options not checked: ${planned.issues[0]?.path}`);
      bytes = text.encode(gcodeText(planned.plan, {
        boardName: design.name,
        revision: context.revision ?? null,
        fingerprint: context.fingerprint ?? designFingerprint(design),
        approvalWarning: context.approvalWarning ?? null,
      }));
      break;
    }
    case 'cutlist':
      bytes = text.encode(cutListCsv(cutList(design, layout, context.wire ?? null, options.stockLength)));
      break;
    case 'cutsheet':
      bytes = await cutSheetPdf(design, layout, options, context);
      break;
  }
  return {
    bytes,
    contentType: EXPORT_CONTENT_TYPES[options.format],
    filename: exportFileName(design.name, options.format, context.revision),
  };
}
