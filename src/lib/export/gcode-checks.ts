/**
 * The checks of export options that need the design (today only G-code's: a tool wider than the
 * slot, a safe Z inside the wood), shared by the API routes (400 naming the option), the command
 * line and the Export panel, and the plan they lead to.
 */
import type { Layout } from '~/lib/geometry/layout.ts';
import type { Design } from '~/lib/schemas/design.ts';
import type { ExportOptions } from '~/lib/schemas/export-options.ts';
import { planToolpath, type PlanResult } from './gcode-plan.ts';
import { gcodeSettings, type SettingIssue } from './gcode-settings.ts';

/** The toolpath of a design with these options, or the options' issues. */
export function designToolpath(design: Design, layout: Layout, options: ExportOptions): PlanResult {
  const settings = gcodeSettings(design, options);
  return settings.ok ? planToolpath(design, layout, settings.settings) : settings;
}

/** Issues with `options` for this design (none for formats without design-dependent options). */
export function exportOptionIssues(design: Design, layout: Layout, options: ExportOptions): SettingIssue[] {
  if (options.format !== 'gcode') return [];
  const planned = designToolpath(design, layout, options);
  return planned.ok ? [] : planned.issues;
}
