/**
 * GET /api/templates/{id}/label?size=... (label PDF) and
 * GET /api/templates/{id}/index-template?format=dxf|pdf (the strip to cut the template from; a
 * typed fanned template also takes nutSpacing, saddleSpacing and perpendicularFret).
 * The PDFs are built in the export worker pool; a strip too large for one PDF page is a 422.
 */
import type { SessionUser } from '~/lib/auth/index.server.ts';
import { config } from '~/lib/config/env.server.ts';
import { db } from '~/lib/db/client.server.ts';
import { revisionFingerprint } from '~/lib/db/designs.server.ts';
import { templateDesign } from '~/lib/templates/shelf.server.ts';
import { tooLarge } from '~/lib/export/design-export.server.ts';
import { indexTemplateCost, labelCost, refuseOverCap } from '~/lib/export/export-cost.ts';
import { attachmentHeader, exportFileName } from '~/lib/export/file-name.ts';
import { indexTemplateStrip } from '~/lib/templates/index-template.ts';
import { indexTemplateDxf } from '~/lib/templates/index-template-dxf.server.ts';
import { LABEL_SIZES, labelSize } from '~/lib/templates/index-template-label.server.ts';
import { indexTemplatePage } from '~/lib/templates/index-template-page.ts';
import { pdfResponse } from '~/lib/export/pdf-kit.server.ts';
import { runExport } from '~/lib/export/worker/run-export.server.ts';
import { invalid, problem, zodIssues } from '~/lib/http/problem.ts';
import { answerOrServerError } from '~/lib/http/server-error.server.ts';
import type { Design } from '~/lib/schemas/design.ts';
import { FAN_GEOMETRY_LABELS, fanGeometrySchema, type TemplateView } from '~/lib/schemas/template.ts';
import { fannedStandInDesign } from '~/lib/templates/template-design.ts';
import { shelfTemplate, type Allowed } from '~/lib/templates/route-context.server.ts';

export function labelRoute(user: SessionUser | null, id: string | undefined, url: URL, signal?: AbortSignal): Promise<Response> {
  return answerOrServerError('The label', () => label(user, id, url, signal));
}

async function label(user: SessionUser | null, id: string | undefined, url: URL, signal: AbortSignal | undefined): Promise<Response> {
  const found = await shelfTemplate(user, id);
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
  const run = await runExport({ kind: 'label', content, size, filename }, signal);
  return run.ok ? pdfResponse(run.file.bytes, run.file.filename) : run.response;
}

export function indexTemplateRoute(user: SessionUser | null, id: string | undefined, url: URL, signal?: AbortSignal): Promise<Response> {
  return answerOrServerError('The index template', () => indexTemplate(user, id, url, signal));
}

async function indexTemplate(user: SessionUser | null, id: string | undefined, url: URL, signal: AbortSignal | undefined): Promise<Response> {
  const found = await shelfTemplate(user, id);
  if (!found.ok) return found.response;
  const format = url.searchParams.get('format') ?? 'pdf';
  if (format !== 'pdf' && format !== 'dxf') return problem(400, 'format must be pdf or dxf', { field: 'format' });
  const { template } = found.value;
  const design = await stripDesign(found.value.user.shopId, template, url);
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
  const run = await runExport({ kind: 'index-template', strip, filename: fileName('pdf') }, signal);
  return run.ok ? pdfResponse(run.file.bytes, run.file.filename) : run.response;
}

/** The fingerprint of the board revision the template was made from; null for typed scale lengths. */
function templateFingerprint(shopId: number, template: TemplateView): Promise<string | null> {
  if (template.designId === null || template.revision === null) return Promise.resolve(null);
  return revisionFingerprint(shopId, template.designId, template.revision);
}

const FAN_FIELDS = Object.keys(FAN_GEOMETRY_LABELS) as (keyof typeof FAN_GEOMETRY_LABELS)[];

/**
 * The design the strip is cut from: the template's own design, or its stand-in. A typed fanned
 * template's slot angles depend on the string spacing and perpendicular fret it has no record
 * of, so those come from the query (`nutSpacing`, `saddleSpacing`, `perpendicularFret`).
 */
/** The design the strip is drawn from, and the board revision it is (null for a stand-in from typed values). */
async function stripDesign(shopId: number, template: TemplateView, url: URL): Promise<Allowed<{ design: Design; revision: number | null }>> {
  const reference = await templateDesign(db(), shopId, template);
  if (!reference) return { ok: false, response: problem(409, "This template's design could not be read", { field: 'designId' }) };
  if (!reference.standIn) return { ok: true, value: { design: reference.design, revision: template.revision } };
  if (template.trebleScale === template.bassScale) return { ok: true, value: { design: reference.design, revision: null } };

  const given = FAN_FIELDS.filter((field) => (url.searchParams.get(field) ?? '').trim() !== '');
  const missing = FAN_FIELDS.filter((field) => !given.includes(field));
  if (missing.length > 0) {
    const words = missing.map((field) => FAN_GEOMETRY_LABELS[field]);
    const message =
      `This fanned template has typed scale lengths only, so its slot angles also need the ${words.join(' and the ')}. ` +
      `Add ${missing.join(', ')} to the request (lengths in ${template.units}; perpendicular fret 0 = the nut), or link the template to a design.`;
    return {
      ok: false,
      response: problem(400, message, { field: missing[0], issues: missing.map((field) => ({ path: field, message: `the ${FAN_GEOMETRY_LABELS[field]} is missing` })) }),
    };
  }
  const fan = fanGeometrySchema.safeParse(Object.fromEntries(given.map((field) => [field, Number(url.searchParams.get(field))])));
  if (!fan.success) return { ok: false, response: invalid(zodIssues(fan.error)) };
  const design = fannedStandInDesign(template, fan.data);
  return design.ok ? { ok: true, value: { design: design.design, revision: null } } : { ok: false, response: invalid(design.issues) };
}
