/**
 * Demo seed: three templates on the invented shop's shelf, one with a saved Template check.
 * Templates link to the matching demo design when the Boards seed has created it, otherwise they
 * carry typed scale lengths. Idempotent: a template whose name is already on the shelf is skipped.
 * Names, places and dates are demo data.
 */
import { and, desc, eq } from 'drizzle-orm';
import type { SeedContext } from './demo-shop.server.ts';
import { boards, templateChecks, templates } from '~/lib/db/schema.ts';
import { createTemplate, getTemplate, saveCheck } from '~/lib/templates/shelf.server.ts';
import { equalRemainingFraction } from '~/lib/geometry/temperament.ts';
import { DEMO_DESIGNS } from '~/lib/boards/demo/demo-designs.ts';
import { standInDesign } from '~/lib/templates/template-design.ts';
import { runCheck } from '~/lib/templates/check/run-check.ts';
import type { TemplateCreate } from '~/lib/schemas/template.ts';

interface DemoTemplate {
  /** Demo design (src/lib/boards/demo id) to link to when the shop has it. */
  designPreset: string | null;
  typed: Extract<TemplateCreate, { source: 'typed' }>;
}

const shelf = { condition: 'in_use' as const, notes: '' };

const DEMO_TEMPLATES: readonly DemoTemplate[] = [
  {
    designPreset: 'classical-650',
    typed: {
      ...shelf,
      source: 'typed',
      name: 'Classical 650 master',
      units: 'mm',
      trebleScale: 650,
      bassScale: 650,
      frets: 19,
      slotWidth: 0.55,
      keyWidth: 0.5,
      material: '6 mm aluminium',
      storagePlace: 'Wall rack A, peg 2',
      madeOn: '2025-03-14',
      notes: 'Cut on the shop router from the Kerfline strip.',
    },
  },
  {
    designPreset: null,
    typed: {
      ...shelf,
      source: 'typed',
      name: 'Old 628.65 mm steel-string master',
      units: 'mm',
      trebleScale: 628.65,
      bassScale: 628.65,
      frets: 20,
      slotWidth: 0.6,
      keyWidth: 0.55,
      material: 'Phenolic sheet',
      storagePlace: 'Drawer 3',
      condition: 'worn',
      madeOn: null,
      notes: 'Came with the bench when the shop opened; predates Kerfline. Checked by hand with calipers.',
    },
  },
  {
    designPreset: 'mandolin',
    typed: {
      ...shelf,
      source: 'typed',
      name: 'Mandolin 13.875 in master',
      units: 'in',
      trebleScale: 13.875,
      bassScale: 13.875,
      frets: 20,
      slotWidth: 0.023,
      keyWidth: 0.022,
      material: '1/4 in acrylic',
      storagePlace: 'Wall rack B, peg 1',
      madeOn: '2025-09-02',
    },
  },
];

/** Hand measurements of the old template: small, deterministic deviations (demo data). */
function oldTemplateMeasurements(scale: number, frets: number) {
  const r = equalRemainingFraction(12);
  return Array.from({ length: frets }, (_, i) => {
    const fret = i + 1;
    return { fret, along: 'string-1' as const, fromNut: scale * (1 - r(fret)) + 0.04 * Math.sin(fret * 1.7) };
  });
}

export async function seedDemoTemplates({ db, shopId, people }: SeedContext): Promise<void> {
  for (const demo of DEMO_TEMPLATES) {
    const existing = await db
      .select({ id: templates.id })
      .from(templates)
      .where(and(eq(templates.shopId, shopId), eq(templates.name, demo.typed.name)))
      .limit(1);
    if (existing[0]) continue;
    const presetName = DEMO_DESIGNS.find((d) => d.id === demo.designPreset)?.design.name;
    const [design] = presetName
      ? await db
          .select({ id: boards.id })
          .from(boards)
          .where(and(eq(boards.shopId, shopId), eq(boards.name, presetName)))
          .orderBy(desc(boards.updatedAt))
          .limit(1)
      : [];
    const { name, keyWidth, slotWidth, material, storagePlace, condition, madeOn, notes } = demo.typed;
    const fromDesign = { source: 'design' as const, boardId: design?.id ?? 0, name, keyWidth, slotWidth, material, storagePlace, condition, madeOn, notes };
    const created = design ? await createTemplate(db, shopId, fromDesign) : { ok: false as const };
    const made = created.ok ? created : await createTemplate(db, shopId, demo.typed);
    if (!made.ok) continue;
    if (demo.designPreset === null) await seedOldTemplateCheck(db, shopId, made.value.id, people.get('builder@wrenfield.example'));
  }
}

async function seedOldTemplateCheck(db: SeedContext['db'], shopId: number, templateId: number, builderId: string | undefined): Promise<void> {
  const template = await getTemplate(db, shopId, templateId);
  const design = template && standInDesign(template);
  if (!template || !design || !builderId) return;
  const already = await db.select({ id: templateChecks.id }).from(templateChecks).where(eq(templateChecks.templateId, templateId)).limit(1);
  if (already[0]) return;
  const outcome = runCheck(design, { units: 'mm', tolerance: 0.1, measurements: oldTemplateMeasurements(template.trebleScale, template.frets) });
  if (outcome.ok) await saveCheck(db, shopId, templateId, builderId, outcome.result);
}
