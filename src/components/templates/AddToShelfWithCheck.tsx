/**
 * After checking a physical template against a design: put it on the Template shelf, made from
 * that design revision, with this check saved on it (one request; both are saved or neither).
 */
import { useId, useState, type SyntheticEvent } from 'react';
import type { LengthUnit } from '~/lib/format/units.ts';
import type { CheckGrid } from '~/lib/schemas/template.ts';
import { ApiError, createTemplate } from './shelf-api.ts';

interface Props {
  boardId: number;
  revision: number;
  boardName: string;
  /** The design's units: the jig key width is given in them. */
  units: LengthUnit;
  /** The check as entered, read when the button is pressed. */
  check: () => CheckGrid;
}

type State = { kind: 'idle' | 'saving' } | { kind: 'added'; id: number; name: string } | { kind: 'error'; message: string; field?: string | undefined };

const input = 'rounded border border-paper-line px-2 py-1';

export function AddToShelfWithCheck({ boardId, revision, boardName, units, check }: Props) {
  const [state, setState] = useState<State>({ kind: 'idle' });
  const nameId = useId();
  const keyId = useId();

  async function add(event: SyntheticEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    const name = String(form.get('name') ?? '').trim();
    const keyText = String(form.get('keyWidth') ?? '').trim();
    if (keyText === '') return setState({ kind: 'error', message: 'Enter the width of the jig key that drops into the slots', field: 'keyWidth' });
    setState({ kind: 'saving' });
    try {
      const created = await createTemplate({
        source: 'design',
        boardId,
        revision,
        ...(name ? { name } : {}),
        keyWidth: Number(keyText),
        check: check(),
      });
      setState({ kind: 'added', id: created.id, name: created.name });
    } catch (e) {
      setState(e instanceof ApiError ? { kind: 'error', message: e.message, field: e.field } : { kind: 'error', message: 'Could not reach the server' });
    }
  }

  if (state.kind === 'added') {
    return (
      <p role="status" className="rounded bg-spruce-light p-3 text-sm text-spruce-dark">
        Added to the Template shelf with this check: <a href={`/templates/${state.id}`}>{state.name}</a>.
      </p>
    );
  }
  const keyError = state.kind === 'error' && state.field === 'keyWidth' ? state.message : undefined;
  return (
    <form onSubmit={add} noValidate aria-labelledby={`${nameId}-heading`} className="space-y-2 rounded border border-paper-line bg-white p-3 text-sm">
      <h3 id={`${nameId}-heading`} className="font-semibold">
        Keep this check (optional)
      </h3>
      <p className="text-ink-soft">Adds the template you measured to the Template shelf, made from this revision, with this check saved on it.</p>
      <div className="flex flex-wrap items-end gap-3">
        <div className="flex flex-col gap-1">
          <label htmlFor={nameId}>Template name (blank = {boardName})</label>
          <input id={nameId} name="name" className={input} />
        </div>
        <div className="flex flex-col gap-1">
          <label htmlFor={keyId}>Jig key width ({units})</label>
          <input id={keyId} name="keyWidth" inputMode="decimal" required aria-invalid={keyError ? true : undefined} className={`${input} w-28 font-mono`} />
          {keyError && <span className="text-rosewood">{keyError}</span>}
        </div>
        <button type="submit" disabled={state.kind === 'saving'} className="rounded bg-spruce px-3 py-1.5 text-white disabled:opacity-50">
          {state.kind === 'saving' ? 'Adding…' : 'Add to Template shelf with this check'}
        </button>
      </div>
      {state.kind === 'error' && !keyError && (
        <p role="alert" className="text-rosewood">
          {state.message}
        </p>
      )}
    </form>
  );
}
