/**
 * The exports heavy enough to build off the request thread, as plain data a worker thread can
 * receive, and the one function that builds their bytes. The worker (export-worker.server.ts)
 * only calls `buildExportFile`; the command line calls exportDesign itself, in its own process.
 */
import type { Design } from '~/lib/schemas/design.ts';
import type { ExportOptions } from '~/lib/schemas/export-options.ts';
import { exportDesign, type ExportContext, type ExportFile } from '../export-design.server.ts';
import type { IndexTemplateStrip } from '~/lib/templates/index-template.ts';
import { templateLabelPdf, type LabelContent, type LabelSize } from '~/lib/templates/index-template-label.server.ts';
import { indexTemplatePdf } from '~/lib/templates/index-template-pdf.server.ts';

export type ExportJob =
  | { kind: 'design'; design: Design; options: ExportOptions; context: ExportContext }
  | { kind: 'label'; content: LabelContent; size: LabelSize; filename: string }
  | { kind: 'index-template'; strip: IndexTemplateStrip; filename: string };

/** Builds the file a job asks for. */
export async function buildExportFile(job: ExportJob): Promise<ExportFile> {
  switch (job.kind) {
    case 'design':
      return exportDesign(job.design, job.options, job.context);
    case 'label':
      return { bytes: await templateLabelPdf(job.content, job.size), contentType: 'application/pdf', filename: job.filename };
    case 'index-template':
      return { bytes: (await indexTemplatePdf(job.strip)).bytes, contentType: 'application/pdf', filename: job.filename };
  }
}
