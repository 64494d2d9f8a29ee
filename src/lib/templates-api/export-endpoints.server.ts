/**
 * GET /api/templates/{id}/label?size=... (label PDF) and
 * GET /api/templates/{id}/index-template?format=dxf|pdf (the strip to cut the template from).
 */
import type { SessionUser } from '~/lib/auth/index.server';
import { config } from '~/lib/config/env.server';
import { db } from '~/lib/db/client.server';
import { templateDesign } from '~/lib/db/templates.server';
import { indexTemplateStrip } from '~/lib/export/index-template';
import { indexTemplateDxf } from '~/lib/export/index-template-dxf';
import { LABEL_SIZES, labelSize, templateLabelPdf } from '~/lib/export/index-template-label.server';
import { indexTemplatePdf } from '~/lib/export/index-template-pdf.server';
import { pdfResponse } from '~/lib/export/pdf-kit.server';
import { problem } from '~/lib/http/problem';
import { shelfTemplate } from './route-context.server';

/** A file name from the template's name: letters, digits and dashes only. */
function fileStem(name: string, id: number): string {
  const stem = name.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '').slice(0, 60);
  return stem ? `${stem}-${id}` : `template-${id}`;
}

export async function labelRoute(user: SessionUser | null, id: string | undefined, url: URL): Promise<Response> {
  const found = await shelfTemplate(user, id);
  if (!found.ok) return found.response;
  const sizeId = url.searchParams.get('size') ?? '89x36';
  const size = labelSize(sizeId);
  if (!size) return problem(400, `size must be one of: ${LABEL_SIZES.map((s) => s.id).join(', ')}`, { field: 'size' });
  const { template } = found.value;
  const bytes = await templateLabelPdf({ ...template, url: `${config().appOrigin}/templates/${template.id}` }, size);
  return pdfResponse(bytes, `${fileStem(template.name, template.id)}-label-${size.id}.pdf`);
}

export async function indexTemplateRoute(user: SessionUser | null, id: string | undefined, url: URL): Promise<Response> {
  const found = await shelfTemplate(user, id);
  if (!found.ok) return found.response;
  const format = url.searchParams.get('format') ?? 'pdf';
  if (format !== 'pdf' && format !== 'dxf') return problem(400, 'format must be pdf or dxf', { field: 'format' });
  const { template } = found.value;
  const reference = await templateDesign(db(), found.value.user.shopId, template);
  if (!reference || (reference.standIn && template.trebleScale !== template.bassScale)) {
    // Slot angles of a fanned board need its string spacing and perpendicular fret.
    return problem(409, 'A fanned index template can only be exported from its design; link the template to a design first', { field: 'designId' });
  }
  const strip = indexTemplateStrip(reference.design, template.keyWidth);
  const stem = `${fileStem(template.name, template.id)}-index-template`;
  if (format === 'dxf') {
    return new Response(indexTemplateDxf(strip), {
      status: 200,
      headers: {
        'content-type': 'application/dxf',
        'content-disposition': `attachment; filename="${stem}.dxf"`,
        'cache-control': 'no-store',
      },
    });
  }
  const pdf = await indexTemplatePdf(strip);
  return pdfResponse(pdf.bytes, `${stem}.pdf`);
}
