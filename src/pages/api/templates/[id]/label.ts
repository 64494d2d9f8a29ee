import type { APIRoute } from 'astro';
import { config } from '~/lib/config/env.server.ts';
import { tooLarge } from '~/lib/export/design-export.server.ts';
import { labelCost, refuseOverCap } from '~/lib/export/export-cost.ts';
import { exportFileName } from '~/lib/export/file-name.ts';
import { pdfResponse } from '~/lib/export/pdf-kit.server.ts';
import { runExport } from '~/lib/export/worker/run-export.server.ts';
import { problem } from '~/lib/http/problem.ts';
import { answerOrServerError } from '~/lib/http/server-error.server.ts';
import { templateFingerprint } from '~/lib/templates/index-template-design.server.ts';
import { LABEL_SIZES, labelSize } from '~/lib/templates/index-template-label.server.ts';
import { shelfTemplate } from '~/lib/templates/route-context.server.ts';

export const prerender = false;

/** GET /api/templates/{id}/label?size=…: the label PDF (with the board revision and fingerprint it was made from), built in the export worker pool. */
export const GET: APIRoute = ({ locals, params, url, request }) => answerOrServerError('The label', async () => {
  const found = await shelfTemplate(locals.user, params.id);
  if (!found.ok) return found.response;
  const sizeId = url.searchParams.get('size') ?? '89x36';
  const size = labelSize(sizeId);
  if (!size) return problem(400, `size must be one of: ${LABEL_SIZES.map((s) => s.id).join(', ')}`, { field: 'size' });
  const refusal = refuseOverCap(labelCost(size), 'this label', 'size', 'choose a smaller size');
  if (refusal) return tooLarge(refusal);
  const { template } = found.value;
  const fingerprint = await templateFingerprint(found.value.user.shopId, template);
  const content = { ...template, fingerprint, url: `${config().appOrigin}/templates/${template.id}` };
  const filename = exportFileName(template.name, { kind: 'label', templateId: template.id, size: size.id }, template.revision);
  const run = await runExport({ kind: 'label', content, size, filename }, request.signal);
  return run.ok ? pdfResponse(run.value.bytes, run.value.filename) : run.response;
});
