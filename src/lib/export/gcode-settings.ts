/**
 * The G-code options of one export resolved against its design: every length and feed in the
 * design's units, defaults (chosen in mm, converted for inch designs) filled in, and the checks
 * that need the design (a tool wider than the slot, a safe Z inside the wood). Pure: the Export
 * panel shows the same defaults and refusals.
 *
 * Defaults are from memory, common practice for a small router with a fret-slotting bit.
 */
import { fromMm, type LengthUnit } from '~/lib/format/units.ts';
import type { Design } from '~/lib/schemas/design.ts';
import type { ExportOptions } from '~/lib/schemas/export-options.ts';

/** Defaults in millimetres (feeds in mm/min), converted into the design's units. */
export const GCODE_DEFAULTS_MM = {
  feed: 500,
  plungeFeed: 100,
  /** Only for the time estimate: what a hobby router's rapids reach (from memory). */
  rapidRate: 2500,
  safeZ: 5,
  passDepth: 1,
  chordTolerance: 0.01,
  dryRun: 0,
} as const;
export const DEFAULT_SPINDLE_RPM = 18_000;

export interface GcodeSettings {
  units: LengthUnit;
  dialect: ExportOptions['dialect'];
  origin: ExportOptions['origin'];
  zZero: ExportOptions['zZero'];
  /** The cutter's diameter and the slot's width. */
  toolDiameter: number;
  slotWidth: number;
  depth: number;
  /** Design units per minute. */
  feed: number;
  plungeFeed: number;
  rapidRate: number;
  spindle: number;
  safeZ: number;
  passDepth: number;
  chordTolerance: number;
  dryRun: number;
}

export interface SettingIssue {
  path: string;
  message: string;
}

export type SettingsResult = { ok: true; settings: GcodeSettings } | { ok: false; issues: SettingIssue[] };

export function gcodeSettings(design: Design, options: ExportOptions): SettingsResult {
  const units = design.units;
  const given = (value: number | undefined, mm: number) => value ?? fromMm(mm, units);
  const settings: GcodeSettings = {
    units,
    dialect: options.dialect,
    origin: options.origin,
    zZero: options.zZero,
    toolDiameter: options.toolDiameter ?? design.slot.width,
    slotWidth: design.slot.width,
    depth: design.slot.depth,
    feed: given(options.feed, GCODE_DEFAULTS_MM.feed),
    plungeFeed: given(options.plungeFeed, GCODE_DEFAULTS_MM.plungeFeed),
    rapidRate: given(options.rapidRate, GCODE_DEFAULTS_MM.rapidRate),
    spindle: options.spindle ?? DEFAULT_SPINDLE_RPM,
    safeZ: given(options.safeZ, GCODE_DEFAULTS_MM.safeZ),
    passDepth: given(options.passDepth, GCODE_DEFAULTS_MM.passDepth),
    chordTolerance: given(options.chordTolerance, GCODE_DEFAULTS_MM.chordTolerance),
    dryRun: given(options.dryRun, GCODE_DEFAULTS_MM.dryRun),
  };
  const issues: SettingIssue[] = [];
  // Compared with a nanometre's slack so a tool typed as the slot width in the other unit passes.
  if (settings.toolDiameter > settings.slotWidth + fromMm(1e-6, units)) {
    issues.push({ path: 'toolDiameter', message: `must not be wider than the slot (${settings.slotWidth} ${units}): a wider cutter cuts a wider slot` });
  }
  return issues.length === 0 ? { ok: true, settings } : { ok: false, issues };
}
