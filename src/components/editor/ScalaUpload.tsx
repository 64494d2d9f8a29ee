/**
 * Loading a Scala .scl file: the shared parser (geometry/scala.ts, the same code behind the public
 * POST /api/scala) reads it in the browser and the form shows its description and pitches; the
 * design keeps the file's text (validated again by the design schema).
 */
import { useId, useState, type ChangeEvent } from 'react';
import { parseScl, type ScalaScale } from '~/lib/geometry/scala.ts';
import { DESIGN_LIMITS } from '~/lib/schemas/design.ts';
import { FIELD_ERROR } from './control-styles.ts';

/** Largest .scl file read, in bytes: the design keeps at most this many characters of it. */
const SCL_MAX_BYTES = DESIGN_LIMITS.maxSclChars;

export function ScalaUpload({ scl, errors, onLoaded }: { scl: string; errors: readonly string[]; onLoaded: (scl: string) => void }) {
  const inputId = useId();
  const [parsed, setParsed] = useState<ScalaScale | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  const onFile = async (event: ChangeEvent<HTMLInputElement>) => {
    const file = event.target.files?.[0];
    if (!file) return;
    if (file.size > SCL_MAX_BYTES) {
      setProblem(`the file is larger than ${SCL_MAX_BYTES / 1024} KiB`);
      return;
    }
    setBusy(true);
    setProblem(null);
    try {
      const text = await file.text();
      const result = parseScl(text);
      if (!result.ok) {
        setParsed(null);
        setProblem(`line ${result.error.line}: ${result.error.message}`);
        return;
      }
      setParsed(result.scale);
      onLoaded(text);
    } catch (error) {
      setProblem(`could not read the file (${String(error)})`);
    } finally {
      setBusy(false);
    }
  };

  // The schema's verdict on the kept text shows only once there is a text: before any file is
  // chosen the box asks for one instead of reporting an error.
  const shownErrors = [...(problem ? [problem] : []), ...(scl === '' ? [] : errors)];
  return (
    <div className="space-y-1">
      <label htmlFor={inputId} className="block text-sm">Scala file (.scl)</label>
      <input
        id={inputId}
        type="file"
        accept=".scl,text/plain"
        className="block w-full text-sm"
        onChange={onFile}
        aria-invalid={shownErrors.length > 0}
        aria-describedby={shownErrors.length > 0 ? 'error-temperament.scl' : undefined}
      />
      {busy && <p className="text-xs" role="status">Reading the file…</p>}
      {shownErrors.length > 0 && (
        <p id="error-temperament.scl" className={FIELD_ERROR}>{shownErrors.join('; ')}</p>
      )}
      {parsed ? (
        <div className="text-xs">
          <p><span className="font-semibold">Description:</span> {parsed.description || '(none)'}</p>
          <p className="font-semibold">Pitches (cents above the open string):</p>
          <ol className="max-h-32 list-decimal overflow-auto pl-6 font-mono">
            {parsed.pitches.map((pitch, index) => (
              <li key={index}>{pitch.text} = {pitch.cents.toFixed(3)} cents</li>
            ))}
          </ol>
        </div>
      ) : (
        <p className="text-xs text-ink-soft">
          {scl === '' ? 'Choose a .scl file: the scale’s pitches set the frets.' : 'A Scala scale is loaded; choose a file to replace it.'}
        </p>
      )}
    </div>
  );
}
