import { db } from '~/lib/db/client.server.ts';
import { revisionFingerprint } from '~/lib/boards/boards.server.ts';
import { invalid, problem, zodIssues, type Checked } from '~/lib/http/problem.ts';
import type { Design } from '~/lib/schemas/design.ts';
import { FAN_GEOMETRY_LABELS, fanGeometrySchema, type TemplateView } from '~/lib/schemas/template.ts';
import { templateDesign } from '~/lib/templates/shelf.server.ts';
import { fannedStandInDesign } from '~/lib/templates/template-design.ts';

const FAN_FIELDS = Object.keys(FAN_GEOMETRY_LABELS) as (keyof typeof FAN_GEOMETRY_LABELS)[];

/**
 * The design the index template strip is cut from, and the board revision it is: the template's
 * own design, or its stand-in (revision null). A typed fanned template's slot angles depend on
 * the string spacing and perpendicular fret it has no record of, so those come from the query
 * (`nutSpacing`, `saddleSpacing`, `perpendicularFret`); a missing one is a 400 naming it.
 */
export async function indexTemplateDesign(shopId: number, template: TemplateView, url: URL): Promise<Checked<{ design: Design; revision: number | null }>> {
  const reference = await templateDesign(db(), shopId, template);
  if (!reference) return { ok: false, response: problem(409, "This template's design could not be read", { field: 'boardId' }) };
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

/** The fingerprint of the board revision the template was made from; null for typed scale lengths. */
export function templateFingerprint(shopId: number, template: TemplateView): Promise<string | null> {
  if (template.boardId === null || template.revision === null) return Promise.resolve(null);
  return revisionFingerprint(shopId, template.boardId, template.revision);
}
