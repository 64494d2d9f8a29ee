/**
 * Adds a template to the shelf: made from a saved design (and its current revision), or typed
 * scale lengths for a template that predates Kerfline. The server validates; its error names the
 * field, shown next to it.
 */
import { cloneElement, useId, useState, type ReactElement, type SyntheticEvent } from 'react';
import { ApiError, createTemplate } from './shelf-api.ts';
import { useHydrated } from '~/components/ui/use-hydrated.ts';

export interface BoardChoice {
  id: number;
  name: string;
  revision: number;
  units: 'mm' | 'in';
}

/** A labelled control; the label points at the control by id so its name is the label alone. */
function Field({
  label,
  error,
  children,
}: {
  label: string;
  error?: string | undefined;
  children: ReactElement<{ id?: string; 'aria-invalid'?: boolean | undefined }>;
}) {
  const id = useId();
  return (
    <div className="flex flex-col gap-1 text-sm">
      <label htmlFor={id}>{label}</label>
      {cloneElement(children, { id, 'aria-invalid': error ? true : undefined })}
      {error && <span className="text-rosewood">{error}</span>}
    </div>
  );
}

const input = 'rounded border border-paper-line px-2 py-1';

export function AddTemplateForm({ boards }: { boards: BoardChoice[] }) {
  const [source, setSource] = useState<'design' | 'typed'>(boards.length > 0 ? 'design' : 'typed');
  const [error, setError] = useState<{ message: string; field?: string | undefined } | null>(null);
  const [busy, setBusy] = useState(false);
  const hydrated = useHydrated();

  async function submit(event: SyntheticEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    const text = (name: string) => String(form.get(name) ?? '').trim();
    const number = (name: string) => (text(name) === '' ? undefined : Number(text(name)));
    const shelf = {
      keyWidth: number('keyWidth'),
      material: text('material'),
      storagePlace: text('storagePlace'),
      madeOn: text('madeOn') || null,
      notes: text('notes'),
    };
    const body =
      source === 'design'
        ? { source, boardId: number('boardId'), ...(text('name') ? { name: text('name') } : {}), ...shelf }
        : {
            source,
            name: text('name'),
            units: text('units'),
            trebleScale: number('trebleScale'),
            bassScale: number('bassScale') ?? number('trebleScale'),
            frets: number('frets'),
            slotWidth: number('slotWidth'),
            ...shelf,
          };
    setBusy(true);
    setError(null);
    try {
      const created = await createTemplate(body);
      window.location.assign(`/templates/${created.id}`);
    } catch (e) {
      setError(e instanceof ApiError ? { message: e.message, field: e.field } : { message: 'Could not reach the server' });
      setBusy(false);
    }
  }

  const errorFor = (field: string) => (error?.field === field ? error.message : undefined);
  return (
    <section aria-labelledby="add-template" className="rounded border border-paper-line bg-white p-4">
      <h2 id="add-template" className="mb-3 text-lg font-semibold">
        Add template
      </h2>
      <form onSubmit={submit} noValidate>
        <fieldset disabled={!hydrated} className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
          <legend className="sr-only">New template</legend>
          <fieldset className="sm:col-span-2 lg:col-span-3 flex gap-4 text-sm">
            <legend className="mb-1">Made from</legend>
            <label className="flex items-center gap-1">
              <input
                type="radio"
                name="source"
                checked={source === 'design'}
                onChange={() => setSource('design')}
                disabled={boards.length === 0}
              />
              A saved design
            </label>
            <label className="flex items-center gap-1">
              <input type="radio" name="source" checked={source === 'typed'} onChange={() => setSource('typed')} />
              Typed scale lengths (an older template)
            </label>
          </fieldset>
          {source === 'design' ? (
            <Field label="Design" error={errorFor('boardId') ?? errorFor('revision')}>
              <select name="boardId" className={input}>
                {boards.map((d) => (
                  <option key={d.id} value={d.id}>
                    {d.name} (rev. {d.revision})
                  </option>
                ))}
              </select>
            </Field>
          ) : (
            <>
              <Field label="Units" error={errorFor('units')}>
                <select name="units" className={input} defaultValue="mm">
                  <option value="mm">mm</option>
                  <option value="in">in</option>
                </select>
              </Field>
              <Field label="Treble scale length (units above)" error={errorFor('trebleScale')}>
                <input name="trebleScale" inputMode="decimal" className={input} />
              </Field>
              <Field label="Bass scale length (blank = same as treble)" error={errorFor('bassScale')}>
                <input name="bassScale" inputMode="decimal" className={input} />
              </Field>
              <Field label="Frets" error={errorFor('frets')}>
                <input name="frets" inputMode="numeric" className={input} />
              </Field>
              <Field label="Template slot width (units above)" error={errorFor('slotWidth')}>
                <input name="slotWidth" inputMode="decimal" className={input} />
              </Field>
            </>
          )}
          <Field label={source === 'design' ? 'Name (blank = the design name)' : 'Name'} error={errorFor('name')}>
            <input name="name" className={input} />
          </Field>
          <Field label={`Jig key width (${source === 'design' ? "design's units" : 'units above'})`} error={errorFor('keyWidth')}>
            <input name="keyWidth" inputMode="decimal" className={input} />
          </Field>
          <Field label="Material" error={errorFor('material')}>
            <input name="material" className={input} />
          </Field>
          <Field label="Stored at" error={errorFor('storagePlace')}>
            <input name="storagePlace" className={input} />
          </Field>
          <Field label="Made on" error={errorFor('madeOn')}>
            <input name="madeOn" type="date" className={input} />
          </Field>
          <Field label="Notes" error={errorFor('notes')}>
            <textarea name="notes" rows={2} className={input} />
          </Field>
          <div className="sm:col-span-2 lg:col-span-3 flex items-center gap-3">
            <button type="submit" disabled={busy} className="rounded bg-spruce px-3 py-1.5 text-white disabled:opacity-50">
              {busy ? 'Adding…' : 'Add template'}
            </button>
            {error && !error.field && (
              <p role="alert" className="text-sm text-rosewood">
                {error.message}
              </p>
            )}
            {error?.field && (
              <p role="alert" className="text-sm text-rosewood">
                Check the field marked: {error.message}
              </p>
            )}
          </div>
        </fieldset>
      </form>
    </section>
  );
}
