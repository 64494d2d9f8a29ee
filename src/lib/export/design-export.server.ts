/**
 * A design's export as the HTTP answer, for POST /api/export and a saved board's
 * GET /api/boards/{id}/export: refused with 422 naming the option to change when it would pass
 * a cap (export-cost.ts), 400 naming the option when a G-code option does not suit the design,
 * the PDFs (paper template, cut sheet) built in the worker pool, text formats (a few ms at most)
 * built here.
 */
import { computeLayout } from '~/lib/geometry/layout.ts';
import { invalid, problem } from '~/lib/http/problem.ts';
import type { Design } from '~/lib/schemas/design.ts';
import type { ExportOptions } from '~/lib/schemas/export-options.ts';
import { layoutExportRefusal, type ExportRefusal } from './export-cost.ts';
import { exportDesign, type ExportContext, type ExportFile } from './export-design.server.ts';
import { TOO_LARGE_STATUS } from './export-limits.ts';
import { exportOptionIssues } from './gcode-checks.ts';
import { attachmentHeader } from './file-name.ts';
import type { ExportPool } from './worker/export-pool.server.ts';
import { runExport } from './worker/run-export.server.ts';

/** 422 in the problem shape, `field` naming the option to change. */
export function tooLarge(refusal: ExportRefusal): Response {
  return problem(TOO_LARGE_STATUS, refusal.message, { field: refusal.field, issues: [{ path: refusal.field, message: refusal.message }] });
}

/** `signal` is the request's: a client that hangs up cancels the job. `pool` is for tests. */
export async function designExportResponse(
  design: Design,
  options: ExportOptions,
  context: ExportContext,
  signal: AbortSignal | undefined,
  pool?: ExportPool,
): Promise<Response> {
  const layout = computeLayout(design);
  const issues = exportOptionIssues(design, layout, options);
  if (issues.length > 0) return invalid(issues);
  const refusal = layoutExportRefusal(layout, options, design);
  if (refusal) return tooLarge(refusal);
  let file: ExportFile;
  if (options.format === 'pdf' || options.format === 'cutsheet') {
    const run = await runExport({ kind: 'design', design, options, context }, signal, pool);
    if (!run.ok) return run.response;
    file = run.value;
  } else {
    file = await exportDesign(design, options, context);
  }
  return new Response(new Uint8Array(file.bytes), {
    status: 200,
    headers: {
      'content-type': file.contentType,
      'content-disposition': attachmentHeader(file.filename),
      'content-length': String(file.bytes.byteLength),
      'cache-control': 'no-store',
    },
  });
}
