/**
 * The Export panel's G-code part: the toolpath options (lengths in the design's units, feeds in
 * its units per minute; empty = the default shown), the toolpath preview and the run-time
 * estimate, all from the same plan the G-code file is written from.
 */
import { useMemo } from 'react';
import { designToolpath } from '~/lib/export/gcode-checks.ts';
import { DEFAULT_SPINDLE_RPM, GCODE_DEFAULTS_MM } from '~/lib/export/gcode-settings.ts';
import { toolpathPreview } from '~/lib/export/toolpath-preview.ts';
import { formatLength, fromMm } from '~/lib/format/units.ts';
import type { Layout } from '~/lib/geometry/layout.ts';
import type { Design } from '~/lib/schemas/design.ts';
import { GCODE_DIALECTS, Z_ZEROS, type ExportOptions } from '~/lib/schemas/export-options.ts';
import { ToolpathPreview } from './ToolpathPreview.tsx';

export const GCODE_FIELDS = ['toolDiameter', 'feed', 'plungeFeed', 'spindle', 'safeZ', 'passDepth', 'chordTolerance', 'dryRun', 'rapidRate'] as const;
export type GcodeField = (typeof GCODE_FIELDS)[number];

const DIALECT_LABELS: Record<(typeof GCODE_DIALECTS)[number], string> = { linuxcnc: 'LinuxCNC', grbl: 'GRBL' };
const Z_ZERO_LABELS: Record<(typeof Z_ZEROS)[number], string> = {
  crown: 'Board top on the centre line (the crown)',
  'edge-at-nut': 'Board top at the nut, treble edge',
};

interface Props {
  design: Design;
  layout: Layout;
  values: Record<GcodeField | 'dialect' | 'zZero', string>;
  onChange: (key: GcodeField | 'dialect' | 'zZero', value: string) => void;
  errors: ReadonlyMap<string, string>;
  /** The validated options, or null while one is wrong. */
  options: ExportOptions | null;
}

export function GcodeFields({ design, layout, values, onChange, errors, options }: Props) {
  const u = design.units;
  const perMinute = `${u}/min`;
  const defaults: Record<GcodeField, { label: string; unit: string; value: string }> = {
    toolDiameter: { label: 'Cutter diameter', unit: u, value: `${formatLength(design.slot.width, u)} (the slot width)` },
    feed: { label: 'Cutting feed', unit: perMinute, value: formatLength(fromMm(GCODE_DEFAULTS_MM.feed, u), u) },
    plungeFeed: { label: 'Plunge feed', unit: perMinute, value: formatLength(fromMm(GCODE_DEFAULTS_MM.plungeFeed, u), u) },
    spindle: { label: 'Spindle speed', unit: 'rpm', value: String(DEFAULT_SPINDLE_RPM) },
    safeZ: { label: 'Safe Z above Z zero', unit: u, value: formatLength(fromMm(GCODE_DEFAULTS_MM.safeZ, u), u) },
    passDepth: { label: 'Deepest cut per pass', unit: u, value: formatLength(fromMm(GCODE_DEFAULTS_MM.passDepth, u), u) },
    chordTolerance: { label: 'Chord tolerance (straight moves off the radius)', unit: u, value: formatLength(fromMm(GCODE_DEFAULTS_MM.chordTolerance, u), u) },
    dryRun: { label: 'Dry run: raise every Z by (0 = a real cut)', unit: u, value: '0' },
    rapidRate: { label: 'Rapid rate, for the time estimate', unit: perMinute, value: formatLength(fromMm(GCODE_DEFAULTS_MM.rapidRate, u), u) },
  };
  const planned = useMemo(() => (options ? designToolpath(design, layout, { ...options, format: 'gcode' }) : null), [design, layout, options]);
  const preview = useMemo(() => (planned?.ok ? toolpathPreview(planned.plan, layout) : null), [planned, layout]);
  const planIssues = new Map(planned && !planned.ok ? planned.issues.map((i) => [i.path, i.message]) : []);
  const problem = (key: string) => errors.get(key) ?? planIssues.get(key);
  const select = 'rounded border border-paper-line bg-white px-2 py-1';

  return (
    <fieldset className="space-y-3">
      <legend className="mb-2 font-medium">Slot toolpath (G-code)</legend>
      <p className="text-xs text-ink-soft">
        Same origin and axes as the slot paths; Z up, cutting {formatLength(design.slot.depth, u, true)} below the
        {design.radius.nut === 0 ? ' flat' : ' radiused'} top (Slots, "Slot depth"). Leave a field empty for its default.
      </p>
      <div className="grid gap-3 sm:grid-cols-3">
        <div className="flex flex-col gap-1 text-sm">
          <label htmlFor="export-dialect">Controller</label>
          <select id="export-dialect" className={select} value={values.dialect} onChange={(e) => onChange('dialect', e.target.value)}>
            {GCODE_DIALECTS.map((name) => <option key={name} value={name}>{DIALECT_LABELS[name]}</option>)}
          </select>
        </div>
        <div className="flex flex-col gap-1 text-sm">
          <label htmlFor="export-zZero">Z zero touched off on</label>
          <select id="export-zZero" className={select} value={values.zZero} onChange={(e) => onChange('zZero', e.target.value)}>
            {Z_ZEROS.map((name) => <option key={name} value={name}>{Z_ZERO_LABELS[name]}</option>)}
          </select>
        </div>
        {GCODE_FIELDS.map((key) => (
          <div key={key} className="flex flex-col gap-1 text-sm">
            <label htmlFor={`export-${key}`}>{defaults[key].label} ({defaults[key].unit})</label>
            <input
              id={`export-${key}`}
              className={`${select} font-mono`}
              inputMode="decimal"
              value={values[key]}
              placeholder={`default ${defaults[key].value}`}
              onChange={(e) => onChange(key, e.target.value)}
              aria-invalid={problem(key) !== undefined}
              aria-describedby={problem(key) !== undefined ? `export-${key}-error` : undefined}
            />
            {problem(key) !== undefined && <span id={`export-${key}-error`} className="text-xs text-rosewood">{problem(key)}</span>}
          </div>
        ))}
      </div>
      {preview && (
        <>
          <ToolpathPreview preview={preview} units={u} />
          <p className="text-sm" aria-live="polite" data-testid="run-time">
            Estimated run time {preview.minutes.total.toFixed(1)} min (cutting {preview.minutes.cutting.toFixed(1)}, plunging {preview.minutes.plunging.toFixed(1)}, rapids{' '}
            {preview.minutes.rapid.toFixed(1)}); {preview.moves} moves. Acceleration is ignored, so the machine takes longer.
          </p>
        </>
      )}
    </fieldset>
  );
}
