/**
 * The Export panel: options for the paper template, the slot paths and the slot toolpath, a
 * preview of the page tiling (the same tile-pages module the PDF uses) and of the toolpath (the
 * same plan the G-code is written from), the cut list, and downloads: a saved board's from
 * GET /api/boards/{id}/export (so every file names its revision and fingerprint; unsaved
 * changes become a revision first), an unsaved design's from POST /api/export.
 */
import { useMemo, useState } from 'react';
import { MACHINE_SAFETY_NOTES, PRINT_CAUTION } from '~/lib/export/safety-note.ts';
import { EXPORT_LIMITS } from '~/lib/export/export-limits.ts';
import { PAPER_LABELS, PAPER_NAMES, ptToMm } from '~/lib/export/paper-sizes.ts';
import { sheetDrawing } from '~/lib/export/sheet-drawing.ts';
import { planTiles } from '~/lib/export/tile-pages.ts';
import { computeLayout } from '~/lib/geometry/layout.ts';
import { formatLength, fromMm } from '~/lib/format/units.ts';
import type { Design } from '~/lib/schemas/design.ts';
import {
  DEFAULT_EXPORT_OPTIONS,
  ORIENTATIONS,
  ORIGINS,
  SLOT_STYLES,
  validateExportOptions,
  type ExportFormat,
} from '~/lib/schemas/export-options.ts';
import { CutListTable } from './CutListTable.tsx';
import { exportFailureMessage, type ExportProblem } from './export-failure.ts';
import { GCODE_FIELDS, GcodeFields, type GcodeField } from './GcodeFields.tsx';
import { TilingPreview } from './TilingPreview.tsx';

interface Props {
  design: Design;
  /** The open saved board, if any; `ready` is false while the editor still has edits to autosave. */
  board?: { id: number; fingerprint: string; approval: { revision: number; fingerprint: string } | null; ready: boolean } | null;
}

interface FormState extends Record<GcodeField, string> {
  dialect: string;
  zZero: string;
  /** Cut list stock length in the design's units; empty = the fret wire's. */
  stockLength: string;
  paper: string;
  orientation: string;
  overlap: string;
  strings: boolean;
  kerf: boolean;
  mirror: boolean;
  toSaddle: boolean;
  distances: boolean;
  slots: string;
  origin: string;
}

const DOWNLOADS: { format: ExportFormat; label: string }[] = [
  { format: 'pdf', label: 'Paper template (PDF)' },
  { format: 'dxf', label: 'Slot paths (DXF)' },
  { format: 'svg', label: 'Slot paths (SVG)' },
  { format: 'csv', label: 'Fret table (CSV)' },
  { format: 'gcode', label: 'Slot toolpath (G-code)' },
  { format: 'cutlist', label: 'Cut list (CSV)' },
  { format: 'cutsheet', label: 'Shop cut sheet (PDF)' },
];

const ORIENTATION_LABELS: Record<(typeof ORIENTATIONS)[number], string> = {
  auto: 'Automatic (fewest pages)',
  portrait: 'Portrait',
  landscape: 'Landscape',
};
const SLOT_LABELS: Record<(typeof SLOT_STYLES)[number], string> = {
  lines: 'Single lines',
  outlines: 'Closed outlines of the slot width',
};
const ORIGIN_LABELS: Record<(typeof ORIGINS)[number], string> = {
  'nut-centre': 'Nut centre (board coordinates)',
  'lower-left': "Board's lower-left corner",
};

type Status = { state: 'idle' } | { state: 'busy'; format: ExportFormat } | { state: 'done'; message: string } | { state: 'error'; message: string };

export default function ExportPanel({ design, board = null }: Props) {
  const defaults = DEFAULT_EXPORT_OPTIONS;
  const [form, setForm] = useState<FormState>({
    paper: defaults.paper,
    orientation: defaults.orientation,
    overlap: String(defaults.overlap),
    strings: defaults.strings,
    kerf: defaults.kerf,
    mirror: defaults.mirror,
    toSaddle: defaults.toSaddle,
    distances: defaults.distances,
    slots: defaults.slots,
    origin: defaults.origin,
    dialect: defaults.dialect,
    zZero: defaults.zZero,
    stockLength: '',
    ...(Object.fromEntries(GCODE_FIELDS.map((key) => [key, ''])) as Record<GcodeField, string>),
  });
  const [status, setStatus] = useState<Status>({ state: 'idle' });
  const set = <K extends keyof FormState>(key: K, value: FormState[K]) => setForm((f) => ({ ...f, [key]: value }));

  // An empty G-code or cut list field means its default.
  const given = Object.fromEntries(Object.entries(form).filter(([, value]) => value !== ''));
  const validation = validateExportOptions(given);
  const errors = new Map(validation.ok ? [] : validation.issues.map((i) => [i.path, i.message]));
  const layout = useMemo(() => computeLayout(design), [design]);
  const optionsKey = validation.ok ? JSON.stringify(validation.options) : null;
  const preview = useMemo(() => {
    if (!validation.ok) return null;
    const drawing = sheetDrawing(layout, validation.options);
    const outline = drawing.items.find((item) => item.kind === 'polygon' && item.style === 'outline');
    return {
      plan: planTiles(drawing.bounds, validation.options),
      outline: outline?.kind === 'polygon' ? outline.points : [],
    };
    // optionsKey stands for validation.options, which is a new object on every render.
  }, [layout, optionsKey]);

  async function download(format: ExportFormat) {
    if (!validation.ok) return;
    setStatus({ state: 'busy', format });
    const query = new URLSearchParams({ ...(given as Record<string, string>), format, strings: String(form.strings), kerf: String(form.kerf), mirror: String(form.mirror), toSaddle: String(form.toSaddle), distances: String(form.distances) });
    try {
      const response = board
        ? await fetch(`/api/boards/${board.id}/export?${query}`, { credentials: 'same-origin' })
        : await fetch(`/api/export?${query}`, {
            method: 'POST',
            headers: { 'content-type': 'application/json' },
            body: JSON.stringify(design),
          });
      if (!response.ok) {
        const problem = (await response.json().catch(() => ({}))) as ExportProblem;
        setStatus({ state: 'error', message: exportFailureMessage(response.status, problem, response.headers.get('retry-after')) });
        return;
      }
      const blob = await response.blob();
      const name = /filename="([^"]+)"/.exec(response.headers.get('content-disposition') ?? '')?.[1] ?? `export.${format}`;
      const url = URL.createObjectURL(blob);
      const link = document.createElement('a');
      link.href = url;
      link.download = name;
      document.body.append(link);
      link.click();
      link.remove();
      setTimeout(() => URL.revokeObjectURL(url), 10_000);
      setStatus({ state: 'done', message: `Downloaded ${name} (${Math.ceil(blob.size / 1024)} KiB).` });
    } catch {
      setStatus({ state: 'error', message: 'The server could not be reached; nothing was downloaded.' });
    }
  }

  const field = 'flex flex-col gap-1 text-sm';
  const input = 'rounded border border-paper-line bg-white px-2 py-1';
  const error = (name: string) =>
    errors.has(name) ? (
      <span id={`export-${name}-error`} className="text-xs text-rosewood">
        {errors.get(name)}
      </span>
    ) : null;
  const plan = preview?.plan;

  return (
    <section aria-labelledby="export-panel-title" className="space-y-4 rounded border border-paper-line bg-white p-4">
      <h2 id="export-panel-title" className="text-lg font-semibold">
        Export
      </h2>
      <fieldset className="grid gap-3 sm:grid-cols-3">
        <legend className="mb-2 font-medium">Paper template</legend>
        <div className={field}>
          <label htmlFor="export-paper">Paper</label>
          <select id="export-paper" className={input} value={form.paper} onChange={(e) => set('paper', e.target.value)} aria-invalid={errors.has('paper')}>
            {PAPER_NAMES.map((name) => (
              <option key={name} value={name}>
                {PAPER_LABELS[name]}
              </option>
            ))}
          </select>
          {error('paper')}
        </div>
        <div className={field}>
          <label htmlFor="export-orientation">Orientation</label>
          <select id="export-orientation" className={input} value={form.orientation} onChange={(e) => set('orientation', e.target.value)} disabled={form.paper === 'fit'}>
            {ORIENTATIONS.map((name) => (
              <option key={name} value={name}>
                {ORIENTATION_LABELS[name]}
              </option>
            ))}
          </select>
        </div>
        <div className={field}>
          <label htmlFor="export-overlap">Overlap between pages (mm)</label>
          <input
            id="export-overlap"
            className={`${input} font-mono`}
            type="number"
            min={0}
            step={1}
            value={form.overlap}
            onChange={(e) => set('overlap', e.target.value)}
            // A board longer than the largest PDF page tiles even on `fit`, with this overlap.
            disabled={form.paper === 'fit' && (plan?.tiles.length ?? 1) === 1}
            aria-invalid={errors.has('overlap')}
            aria-describedby={errors.has('overlap') ? 'export-overlap-error' : undefined}
          />
          {error('overlap')}
        </div>
        <label className="flex items-center gap-2 text-sm">
          <input type="checkbox" checked={form.strings} onChange={(e) => set('strings', e.target.checked)} />
          Draw the strings
        </label>
        <label className="flex items-center gap-2 text-sm">
          <input type="checkbox" checked={form.kerf} onChange={(e) => set('kerf', e.target.checked)} />
          Show the slot width as bands
        </label>
        <label className="flex items-center gap-2 text-sm">
          <input type="checkbox" checked={form.mirror} onChange={(e) => set('mirror', e.target.checked)} />
          Mirror (template glued face-down)
        </label>
        <label className="flex items-center gap-2 text-sm">
          <input type="checkbox" checked={form.toSaddle} onChange={(e) => set('toSaddle', e.target.checked)} />
          Draw on to the saddle (otherwise the board only, with a saddle mark on each outer string)
        </label>
        <label className="flex items-center gap-2 text-sm">
          <input type="checkbox" checked={form.distances} onChange={(e) => set('distances', e.target.checked)} />
          Add a last page of fret distances (treble edge, bass edge, centre line)
        </label>
      </fieldset>

      <div className="space-y-1">
        <h3 className="text-sm font-medium">Page tiling preview</h3>
        {plan && preview ? (
          <>
            <TilingPreview plan={plan} outline={preview.outline} />
            <p className="text-sm text-ink-soft" aria-live="polite">
              {plan.tiles.length} page{plan.tiles.length === 1 ? '' : 's'}
              {plan.paper === 'fit'
                ? plan.tiles.length === 1
                  ? ', one sheet sized to the board'
                  : `, sheets sized to the board (${plan.rows} × ${plan.columns}; a PDF page is at most ${Math.round(ptToMm(EXPORT_LIMITS.maxPageSidePt))} mm long)`
                : ` (${plan.rows} row${plan.rows === 1 ? '' : 's'} × ${plan.columns} column${plan.columns === 1 ? '' : 's'}), ${PAPER_LABELS[plan.paper]} ${plan.orientation}`}
            </p>
            {plan.tiles.length > EXPORT_LIMITS.maxPages && (
              <p className="text-sm text-rosewood">
                More than the {EXPORT_LIMITS.maxPages} pages a paper template may have: use a larger paper, less overlap or the sheet sized to the board.
              </p>
            )}
          </>
        ) : (
          <p className="text-sm text-rosewood">Fix the options above to see the pages.</p>
        )}
      </div>

      <fieldset className="grid gap-3 sm:grid-cols-2">
        <legend className="mb-2 font-medium">Slot paths (DXF, SVG)</legend>
        <div className={field}>
          <label htmlFor="export-slots">Slots</label>
          <select id="export-slots" className={input} value={form.slots} onChange={(e) => set('slots', e.target.value)}>
            {SLOT_STYLES.map((name) => (
              <option key={name} value={name}>
                {SLOT_LABELS[name]}
              </option>
            ))}
          </select>
        </div>
        <div className={field}>
          <label htmlFor="export-origin">Origin</label>
          <select id="export-origin" className={input} value={form.origin} onChange={(e) => set('origin', e.target.value)}>
            {ORIGINS.map((name) => (
              <option key={name} value={name}>
                {ORIGIN_LABELS[name]}
              </option>
            ))}
          </select>
        </div>
        <OverrunNote design={design} minimumOverrun={layout.minimumOverrun} />
      </fieldset>

      <GcodeFields
        design={design}
        layout={layout}
        values={form}
        onChange={(key, value) => set(key, value)}
        errors={errors}
        options={validation.ok ? validation.options : null}
      />

      <div className="space-y-2">
        <div className="flex max-w-xs flex-col gap-1 text-sm">
          <label htmlFor="export-stockLength">Wire stock length ({design.units})</label>
          <input
            id="export-stockLength"
            className={`${input} font-mono`}
            inputMode="decimal"
            value={form.stockLength}
            placeholder="the fret wire's"
            onChange={(e) => set('stockLength', e.target.value)}
            aria-invalid={errors.has('stockLength')}
            aria-describedby={errors.has('stockLength') ? 'export-stockLength-error' : undefined}
          />
          {error('stockLength')}
        </div>
        <CutListTable design={design} layout={layout} stockLength={validation.ok ? validation.options.stockLength : undefined} />
      </div>

      <div className="grid gap-4 md:grid-cols-2">
        <div className="space-y-2">
          <h3 className="text-sm font-medium">Downloads</h3>
          {board?.approval && board.approval.fingerprint !== board.fingerprint && (
            <p role="note" className="rounded border border-caution bg-caution-light p-2 text-sm">
              Not the approved layout: the client approved revision {board.approval.revision} ({board.approval.fingerprint}). Every file
              says so; send a new proof before cutting from it.
            </p>
          )}
          {board && !board.ready && <p className="text-sm text-ink-soft">Waiting for the autosave, so the files match what you see…</p>}
          <div className="flex flex-wrap gap-2">
            {DOWNLOADS.map(({ format, label }) => (
              <button
                key={format}
                type="button"
                className="rounded bg-spruce px-3 py-1.5 text-sm text-white hover:bg-spruce-dark disabled:opacity-50"
                disabled={!validation.ok || status.state === 'busy' || (board !== null && !board.ready)}
                onClick={() => void download(format)}
              >
                Download {label}
              </button>
            ))}
          </div>
          <div role="status" aria-live="polite" className="min-h-6 text-sm">
            {status.state === 'busy' && (
              <span className="flex items-center gap-2">
                <progress aria-label={`Building the ${status.format.toUpperCase()} file`} className="h-2 w-32" />
                Building the {status.format.toUpperCase()} file…
              </span>
            )}
            {status.state === 'done' && <span className="text-spruce">{status.message}</span>}
            {status.state === 'error' && <span className="text-rosewood">{status.message}</span>}
          </div>
        </div>
        <aside aria-label="Safety note" className="rounded border border-caution bg-caution-light p-3 text-sm">
          <p className="font-semibold">Before you cut</p>
          <p>{PRINT_CAUTION}</p>
          <ul className="mt-1 list-disc pl-5">
            {MACHINE_SAFETY_NOTES.map((note) => (
              <li key={note}>{note}</li>
            ))}
          </ul>
        </aside>
      </div>
    </section>
  );
}

/** For CNC: a note when through slots end flush with a slanted edge, suggesting an overrun. */
function OverrunNote({ design, minimumOverrun }: { design: Design; minimumOverrun: number }) {
  if (design.slot.stopped || design.slot.overrun >= minimumOverrun) return null;
  const suggested = formatLength(Math.max(fromMm(1, design.units), minimumOverrun), design.units, true);
  return (
    <p className="text-xs text-ink-soft sm:col-span-2" role="note">
      Through slots end on the board edge, so a slanted slot leaves uncut wood at the corners (they need at least{' '}
      {formatLength(minimumOverrun, design.units, true)} past the edge). For CNC, set "Through slots run past each edge by" under
      Slots to about {suggested}.
    </p>
  );
}
