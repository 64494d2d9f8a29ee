import type { APIRoute } from 'astro';
import { tooLarge } from '~/lib/export/design-export.server.ts';
import { indexTemplateCost, refuseOverCap } from '~/lib/export/export-cost.ts';
import { attachmentHeader, exportFileName } from '~/lib/export/file-name.ts';
import { pdfResponse } from '~/lib/export/pdf-kit.server.ts';
import { runExport } from '~/lib/export/worker/run-export.server.ts';
import { problem } from '~/lib/http/problem.ts';
import { answerOrServerError } from '~/lib/http/server-error.server.ts';
import { indexTemplateStrip } from '~/lib/templates/index-template.ts';
import { indexTemplateDxf } from '~/lib/templates/index-template-dxf.server.ts';
import { indexTemplatePage } from '~/lib/templates/index-template-page.ts';
import { indexTemplateDesign, templateFingerprint } from '~/lib/templates/index-template-design.server.ts';
import { shelfTemplate } from '~/lib/templates/route-context.server.ts';

export const prerender = false;

/**
 * GET /api/templates/{id}/index-template?format=dxf|pdf: the strip to cut the template from (a
 * typed fanned template also takes nutSpacing, saddleSpacing and perpendicularFret). The PDF is
 * built in the export worker pool; a strip too large for one PDF page is a 422.
 */
export const GET: APIRoute = ({ locals, params, url, request }) => answerOrServerError('The index template', async () => {
  const found = await shelfTemplate(locals.user, params.id);
  if (!found.ok) return found.response;
  const format = url.searchParams.get('format') ?? 'pdf';
  if (format !== 'pdf' && format !== 'dxf') return problem(400, 'format must be pdf or dxf', { field: 'format' });
  const { template } = found.value;
  const design = await indexTemplateDesign(found.value.user.shopId, template, url);
  if (!design.ok) return design.response;
  const fingerprint = design.value.revision === null ? null : await templateFingerprint(found.value.user.shopId, template);
  const strip = indexTemplateStrip(design.value.design, template.keyWidth, { revision: design.value.revision, fingerprint });
  const fileName = (format: 'pdf' | 'dxf') => exportFileName(template.name, { kind: 'index-template', templateId: template.id, format }, design.value.revision);
  const cost = indexTemplateCost(strip, format === 'pdf' ? indexTemplatePage(strip).pageSize : null);
  const refusal = refuseOverCap(cost, 'this index template', 'format', 'use format=dxf, which has no page size');
  if (refusal) return tooLarge(refusal);
  if (format === 'dxf') {
    return new Response(indexTemplateDxf(strip), {
      status: 200,
      headers: {
        'content-type': 'application/dxf',
        'content-disposition': attachmentHeader(fileName('dxf')),
        'cache-control': 'no-store',
      },
    });
  }
  const run = await runExport({ kind: 'index-template', strip, filename: fileName('pdf') }, request.signal);
  return run.ok ? pdfResponse(run.value.bytes, run.value.filename) : run.response;
});
