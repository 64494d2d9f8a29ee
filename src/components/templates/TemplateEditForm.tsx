/** Edits a template's shelf record: condition, where it is kept, material and notes. */
import { useState, type SyntheticEvent } from 'react';
import type { TemplateView } from '~/lib/schemas/template.ts';
import { ApiError, patchTemplate } from './shelf-api.ts';
import { ConditionOptions } from './template-labels.tsx';
import { useHydrated } from '~/components/ui/use-hydrated.ts';

const input = 'rounded border border-paper-line px-2 py-1';

export default function TemplateEditForm({ template }: { template: TemplateView }) {
  const hydrated = useHydrated();
  const [state, setState] = useState<
    { kind: 'idle' | 'saving' | 'saved' } | { kind: 'error'; message: string; field?: string | undefined }
  >({
    kind: 'idle',
  });

  async function submit(event: SyntheticEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    const text = (name: string) => String(form.get(name) ?? '').trim();
    setState({ kind: 'saving' });
    try {
      await patchTemplate(template.id, {
        condition: text('condition'),
        storagePlace: text('storagePlace'),
        material: text('material'),
        notes: text('notes'),
      });
      setState({ kind: 'saved' });
    } catch (e) {
      setState(
        e instanceof ApiError
          ? { kind: 'error', message: e.message, field: e.field }
          : { kind: 'error', message: 'Could not reach the server' },
      );
    }
  }

  return (
    <details className="rounded border border-paper-line bg-white p-4">
      <summary className="cursor-pointer font-semibold">Edit shelf record</summary>
      <form onSubmit={submit} className="mt-3">
        <fieldset disabled={!hydrated} className="grid gap-3 sm:grid-cols-2">
          <legend className="sr-only">Shelf record</legend>
          <label className="flex flex-col gap-1 text-sm">
            Condition
            <select name="condition" defaultValue={template.condition} className={input}>
              <ConditionOptions />
            </select>
          </label>
          <label className="flex flex-col gap-1 text-sm">
            Stored at
            <input name="storagePlace" defaultValue={template.storagePlace} className={input} />
          </label>
          <label className="flex flex-col gap-1 text-sm">
            Material
            <input name="material" defaultValue={template.material} className={input} />
          </label>
          <label className="flex flex-col gap-1 text-sm">
            Notes
            <textarea name="notes" defaultValue={template.notes} rows={2} className={input} />
          </label>
          <div className="flex items-center gap-3 sm:col-span-2">
            <button
              type="submit"
              className="rounded bg-spruce px-3 py-1.5 text-white disabled:opacity-50"
              disabled={state.kind === 'saving'}
            >
              Save shelf record
            </button>
            <span aria-live="polite" className="text-sm">
              {state.kind === 'saved' && 'Saved.'}
              {state.kind === 'error' && (
                <span className="text-rosewood">
                  {state.field ? `${state.field}: ` : ''}
                  {state.message}
                </span>
              )}
            </span>
          </div>
        </fieldset>
      </form>
    </details>
  );
}
