/**
 * Template check: measured slot positions entered as a grid or uploaded as CSV, compared at once
 * with the design (the same pure module the server uses). On a shelf template the check is saved
 * on it; against a design alone (any physical template, shelf or not) saving is optional and adds
 * the template to the shelf together with the check. The server checks them again either way.
 */
import { useMemo, useState, type ChangeEvent } from 'react';
import { formatLength, type LengthUnit } from '~/lib/format/units.ts';
import type { Design } from '~/lib/schemas/design.ts';
import type { TemplateView } from '~/lib/schemas/template.ts';
import { defaultTolerance, type Measurement, type WorkMethod } from '~/lib/templates/check/compare.ts';
import { measureLineLabel, measureLines, type MeasureLine } from '~/lib/templates/check/measure-lines.ts';
import { MEASUREMENTS_CSV_MAX_BYTES, parseMeasurementsCsv } from '~/lib/templates/check/measurements-csv.ts';
import { runCheck, runCsvCheck, type CheckOutcome } from '~/lib/templates/check/run-check.ts';
import type { SavedCheck } from '~/lib/templates/shelf.server.ts';
import { AddToShelfWithCheck } from './AddToShelfWithCheck.tsx';
import { DeviationChart } from './DeviationChart.tsx';
import { DiagnosisHeadlines } from './DiagnosisHeadlines.tsx';
import { ApiError, postCheck } from './shelf-api.ts';
import { useHydrated } from '~/components/ui/use-hydrated.ts';

/** What the check is about: a template on the shelf, or a saved design's revision. */
export type CheckSubject =
  | { kind: 'template'; template: TemplateView; checks: SavedCheck[] }
  | { kind: 'design'; boardId: number; revision: number; name: string };

interface Props {
  design: Design;
  subject: CheckSubject;
}

const input = 'rounded border border-paper-line px-2 py-1';

function toleranceText(method: WorkMethod, units: LengthUnit): string {
  return String(Number(defaultTolerance(method, units).toPrecision(6)));
}

export default function TemplateCheckPanel({ design, subject }: Props) {
  const hydrated = useHydrated();
  const fanned = design.scale.treble !== design.scale.bass;
  const lines = measureLines(design.strings);
  const lineLabel = (line: MeasureLine) => measureLineLabel(line, design.strings);
  // One grid column per line measured: both edges on a fanned board, the centre line otherwise.
  const [columns, setColumns] = useState<MeasureLine[]>(fanned ? ['treble-edge', 'bass-edge'] : ['centre-line']);
  const [units, setUnits] = useState<LengthUnit>(design.units);
  const [method, setMethod] = useState<WorkMethod>('hand');
  const [tolerance, setTolerance] = useState(toleranceText('hand', design.units));
  const [mode, setMode] = useState<'grid' | 'csv'>('grid');
  const [grid, setGrid] = useState<Record<string, string>>({});
  const [csv, setCsv] = useState<{ name: string; text: string } | null>(null);
  const [csvTooBig, setCsvTooBig] = useState(false);
  const [checks, setChecks] = useState(subject.kind === 'template' ? subject.checks : []);
  const subjectName = subject.kind === 'template' ? subject.template.name : subject.name;
  const [saveState, setSaveState] = useState<{ kind: 'idle' | 'saving' | 'saved' } | { kind: 'error'; message: string }>({ kind: 'idle' });

  const toleranceValue = Number(tolerance);
  const toleranceOk = tolerance.trim() !== '' && Number.isFinite(toleranceValue) && toleranceValue > 0;
  const measurements: Measurement[] = useMemo(
    () =>
      Object.entries(grid)
        .filter(([, value]) => value.trim() !== '' && Number.isFinite(Number(value)))
        .flatMap(([key, value]) => {
          const [fret, column] = key.split('/').map(Number) as [number, number];
          const along = columns[column];
          return along ? [{ fret, along, fromNut: Number(value) }] : [];
        })
        .sort((a, b) => a.fret - b.fret || lines.indexOf(a.along) - lines.indexOf(b.along)),
    [grid, columns, lines],
  );

  const outcome: CheckOutcome | null = useMemo(() => {
    if (!toleranceOk) return null;
    if (mode === 'csv') return csv ? runCsvCheck(design, csv.text, { units, tolerance: toleranceValue, along: columns[0]! }) : null;
    return measurements.length > 0 ? runCheck(design, { units, tolerance: toleranceValue, measurements }) : null;
  }, [mode, csv, measurements, columns, units, toleranceValue, toleranceOk, design]);

  function chooseMethod(next: WorkMethod) {
    setMethod(next);
    setTolerance(toleranceText(next, units));
  }

  function chooseUnits(next: LengthUnit) {
    setUnits(next);
    setTolerance(toleranceText(method, next));
  }

  async function readCsv(event: ChangeEvent<HTMLInputElement>) {
    const file = event.target.files?.[0];
    setSaveState({ kind: 'idle' });
    if (!file) return setCsv(null);
    setCsvTooBig(file.size > MEASUREMENTS_CSV_MAX_BYTES);
    if (file.size > MEASUREMENTS_CSV_MAX_BYTES) return setCsv(null);
    setCsv({ name: file.name, text: await file.text() });
  }

  /** The entered measurements as the API's grid, CSV rows included (parsed by the same module). */
  function enteredGrid() {
    const parsed = mode === 'csv' && csv ? parseMeasurementsCsv(csv.text, { frets: design.frets, strings: design.strings }, columns[0]!) : null;
    return { units, tolerance: toleranceValue, measurements: parsed ? (parsed.ok ? parsed.measurements : []) : measurements };
  }

  async function save() {
    if (!outcome?.ok || subject.kind !== 'template') return;
    const { template } = subject;
    setSaveState({ kind: 'saving' });
    try {
      const saved = (await postCheck(
        template.id,
        mode === 'csv' && csv
          ? { kind: 'csv', csv: csv.text, units, tolerance: toleranceValue, along: columns[0]! }
          : { kind: 'grid', json: { units, tolerance: toleranceValue, measurements } },
      )) as SavedCheck;
      setChecks((list) => [saved, ...list]);
      setSaveState({ kind: 'saved' });
    } catch (e) {
      setSaveState({ kind: 'error', message: e instanceof ApiError ? e.message : 'Could not reach the server' });
    }
  }

  const result = outcome?.ok ? outcome.result : null;
  const namedLines = new Set(result?.slots.map((slot) => slot.along) ?? []).size > 1 || fanned;

  function chooseLine(column: number, line: MeasureLine) {
    setColumns((list) => list.map((old, i) => (i === column ? line : old)));
  }

  return (
    <div className="space-y-6">
      <section aria-labelledby="check-input" className="space-y-4 rounded border border-paper-line bg-white p-4">
        <h2 id="check-input" className="text-lg font-semibold">
          Template check
        </h2>
        <p className="text-sm text-ink-soft">
          Measure each slot's distance from the nut line (or the zero fret) the printed template marks, along the line you
          choose below, and compare it with{' '}
          {subject.kind === 'design'
            ? `revision ${subject.revision} of the design (${design.name}). Any physical template can be checked here; nothing is saved unless you add it to the Template shelf.`
            : `${subject.template.boardId !== null ? 'the design' : 'the typed scale lengths'} (${design.name}).`}
        </p>
        <p className="text-sm text-ink-soft">
          Each number is compared along the same line it was measured along: the treble or bass edge of the board, the
          centre line, or one string. Lay the rule on that line with its zero on the nut line (the zero fret where the
          design has one) and read where each slot crosses it.{fanned ? ' On a fanned board the edges and the strings give different numbers, so say which you used.' : ''}{' '}
          <a href="/measuring">How Kerfline measures</a>
        </p>
        <fieldset disabled={!hydrated} className="space-y-4">
          <legend className="sr-only">Measurements</legend>
          <div className="flex flex-wrap items-end gap-4">
            <label className="flex flex-col text-sm">
              Measurement units
              <select value={units} onChange={(e) => chooseUnits(e.target.value as LengthUnit)} className={input}>
                <option value="mm">mm</option>
                <option value="in">in</option>
              </select>
            </label>
            <label className="flex flex-col text-sm">
              Work
              <select value={method} onChange={(e) => chooseMethod(e.target.value as WorkMethod)} className={input}>
                <option value="hand">Hand-sawn (±0.1 mm, common practice)</option>
                <option value="cnc">CNC (±0.05 mm, common practice)</option>
              </select>
            </label>
            <label className="flex flex-col text-sm">
              Tolerance ± ({units})
              <input
                value={tolerance}
                onChange={(e) => setTolerance(e.target.value)}
                inputMode="decimal"
                className={`${input} w-28 font-mono`}
                aria-invalid={!toleranceOk}
              />
              {!toleranceOk && <span className="text-rosewood">Enter a tolerance greater than 0</span>}
            </label>
          </div>
          <fieldset className="flex gap-4 text-sm">
            <legend className="mb-1">Enter measurements</legend>
            <label className="flex items-center gap-1">
              <input type="radio" name="mode" checked={mode === 'grid'} onChange={() => setMode('grid')} /> Grid
            </label>
            <label className="flex items-center gap-1">
              <input type="radio" name="mode" checked={mode === 'csv'} onChange={() => setMode('csv')} /> CSV file
            </label>
          </fieldset>
          {mode === 'csv' ? (
            <div className="space-y-1 text-sm">
              <LineSelect
                label="Rows without an along column were measured along"
                value={columns[0]!}
                lines={lines}
                lineLabel={lineLabel}
                onChange={(line) => chooseLine(0, line)}
              />
              <label className="flex flex-col gap-1">
                Measured positions CSV (fret,from_nut or fret,along,from_nut, comma or semicolon separated; up to 64 KiB)
                <input type="file" accept=".csv,text/csv,text/plain" onChange={readCsv} />
              </label>
              {csvTooBig && (
                <p role="alert" className="text-rosewood">
                  The file is larger than 64 KiB.
                </p>
              )}
              {csv && <p className="text-ink-soft">Read {csv.name}.</p>}
            </div>
          ) : (
            <div className="max-h-96 overflow-y-auto">
              <table className="text-sm">
                <caption className="sr-only">Measured distance from the nut per fret</caption>
                <thead>
                  <tr>
                    <th scope="col" className="px-2 text-left">
                      Fret
                    </th>
                    {columns.map((line, column) => (
                      <th key={column} scope="col" className="px-2 text-left align-bottom font-normal">
                        <LineSelect
                          label={`Column ${column + 1}: measured along`}
                          value={line}
                          lines={lines.filter((other) => other === line || !columns.includes(other))}
                          lineLabel={lineLabel}
                          onChange={(next) => chooseLine(column, next)}
                        />
                        <span className="font-semibold">From nut ({units})</span>
                      </th>
                    ))}
                  </tr>
                </thead>
                <tbody>
                  {Array.from({ length: design.frets }, (_, i) => i + 1).map((fret) => (
                    <tr key={fret}>
                      <th scope="row" className="px-2 text-left font-mono">
                        {fret}
                      </th>
                      {columns.map((line, column) => (
                        <td key={column} className="px-2 py-0.5">
                          <input
                            aria-label={`Fret ${fret}, along the ${lineLabel(line)}, measured from nut (${units})`}
                            inputMode="decimal"
                            className={`${input} w-32 font-mono`}
                            value={grid[`${fret}/${column}`] ?? ''}
                            onChange={(e) => setGrid((g) => ({ ...g, [`${fret}/${column}`]: e.target.value }))}
                          />
                        </td>
                      ))}
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          )}
        </fieldset>
      </section>

      {outcome && !outcome.ok && (
        <div role="alert" className="rounded border border-rosewood bg-rosewood-light p-3 text-sm">
          <p className="font-semibold">These measurements cannot be checked yet:</p>
          <ul className="list-disc pl-5">
            {'csvErrors' in outcome
              ? outcome.csvErrors.map((e) => (
                  <li key={`${e.line}-${e.message}`}>
                    Line {e.line}: {e.message}
                  </li>
                ))
              : outcome.errors.map((e) => (
                  <li key={e.field}>
                    Fret {e.fret}: {e.message}
                  </li>
                ))}
          </ul>
        </div>
      )}

      {result && (
        <section aria-labelledby="check-result" className="space-y-4">
          <h2 id="check-result" className="text-lg font-semibold">
            Result
          </h2>
          <p
            role="status"
            data-testid="check-verdict"
            className={`rounded p-3 ${result.passed ? 'bg-spruce-light text-spruce-dark' : 'bg-rosewood-light text-rosewood'}`}
          >
            <strong>{result.passed ? 'Pass. ' : 'Fail. '}</strong>
            {result.summary}
          </p>
          <DiagnosisHeadlines result={result} strings={design.strings} namedLines={namedLines} />
          <figure className="space-y-1">
            <DeviationChart result={result} frets={design.frets} title={`Deviation against fret number for ${subjectName}`} />
            <figcaption className="text-xs text-ink-soft">
              Circles: within tolerance; crosses: outside. Shaded band: ±{formatLength(result.tolerance, result.units, true)}.
              {namedLines ? ` ${chartKey(result.fits.map((fit) => fit.along), lineLabel)}` : ''} The table below has the same numbers.
            </figcaption>
          </figure>
          <ul className="text-sm">
            {result.fits.map((fit) => (
              <li key={fit.along}>
                Best-fit scale{namedLines ? ` (${lineLabel(fit.along)})` : ''}:{' '}
                <span className="font-mono">{formatLength(fit.scale.scaleLength, result.units, true)}</span> (design{' '}
                <span className="font-mono">{formatLength(fit.designScaleLength, result.units, true)}</span>, largest residual{' '}
                <span className="font-mono">{formatLength(fit.scale.maxAbsResidual, result.units, true)}</span>)
                {fit.withOffset && (
                  <>
                    ; with a constant offset:{' '}
                    <span className="font-mono">{formatLength(fit.withOffset.scaleLength, result.units, true)}</span> and{' '}
                    <span className="font-mono">{formatLength(fit.withOffset.offset, result.units, true)}</span>
                  </>
                )}
              </li>
            ))}
          </ul>
          <div className="overflow-x-auto">
            <table className="text-sm">
              <caption className="text-left font-semibold">Slot by slot ({result.units})</caption>
              <thead className="bg-paper-shade">
                <tr>
                  {['Fret', ...(namedLines ? ['Along'] : []), 'Design', 'Measured', 'Deviation', 'Cents', 'Within tolerance'].map((h) => (
                    <th key={h} scope="col" className="px-2 py-1 text-left">
                      {h}
                    </th>
                  ))}
                </tr>
              </thead>
              <tbody className="font-mono">
                {result.slots.map((s) => (
                  <tr key={`${s.fret}/${s.along}`} className="border-t border-paper-line">
                    <td className="px-2">{s.fret}</td>
                    {namedLines && <td className="px-2">{lineLabel(s.along)}</td>}
                    <td className="px-2">{formatLength(s.designFromNut, result.units)}</td>
                    <td className="px-2">{formatLength(s.measuredFromNut, result.units)}</td>
                    <td className="px-2">{formatLength(s.deviation, result.units)}</td>
                    <td className="px-2">{s.cents.toFixed(1)}</td>
                    <td className="px-2">{s.withinTolerance ? 'yes' : 'NO'}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          {subject.kind === 'template' ? (
            <div className="flex items-center gap-3">
              <button
                type="button"
                onClick={save}
                disabled={saveState.kind === 'saving'}
                className="rounded bg-spruce px-3 py-1.5 text-white disabled:opacity-50"
              >
                {saveState.kind === 'saving' ? 'Saving…' : 'Save check'}
              </button>
              <span aria-live="polite" className="text-sm">
                {saveState.kind === 'saved' && 'Saved on the template.'}
                {saveState.kind === 'error' && <span className="text-rosewood">{saveState.message}</span>}
              </span>
            </div>
          ) : (
            <AddToShelfWithCheck boardId={subject.boardId} revision={subject.revision} boardName={subject.name} units={design.units} check={enteredGrid} />
          )}
        </section>
      )}

      {subject.kind === 'template' && (
      <section aria-labelledby="saved-checks" className="space-y-2">
        <h2 id="saved-checks" className="text-lg font-semibold">
          Saved checks
        </h2>
        {checks.length === 0 ? (
          <p className="text-sm text-ink-soft">No checks saved yet.</p>
        ) : (
          <ul className="space-y-1 text-sm">
            {checks.map((c) => (
              <li key={c.id}>
                <span className="font-mono">{c.createdAt.slice(0, 16).replace('T', ' ')}</span>{' '}
                <strong className={c.passed ? 'text-spruce' : 'text-rosewood'}>{c.passed ? 'Pass' : 'Fail'}</strong> at ±
                {formatLength(c.tolerance, c.result.units, true)}: {c.result.summary}
              </li>
            ))}
          </ul>
        )}
      </section>
      )}
    </div>
  );
}

/** The chart draws the first line solid and the others dashed. */
function chartKey(lines: readonly MeasureLine[], lineLabel: (line: MeasureLine) => string): string {
  const [first, ...rest] = lines;
  if (!first) return '';
  return `Solid line: ${lineLabel(first)}${rest.length > 0 ? `; dashed: ${rest.map(lineLabel).join(', ')}` : ''}.`;
}

function LineSelect(props: {
  label: string;
  value: MeasureLine;
  lines: readonly MeasureLine[];
  lineLabel: (line: MeasureLine) => string;
  onChange: (line: MeasureLine) => void;
}) {
  return (
    <label className="flex flex-col text-sm">
      {props.label}
      <select value={props.value} onChange={(e) => props.onChange(e.target.value as MeasureLine)} className={input}>
        {props.lines.map((line) => (
          <option key={line} value={line}>
            {props.lineLabel(line)}
          </option>
        ))}
      </select>
    </label>
  );
}
