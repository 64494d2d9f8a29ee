import type { BoardDetail } from '~/lib/schemas/board.ts';
import type { AutosaveState } from './autosave-state.ts';
import { DesignChanges } from './DesignChanges.tsx';

interface Props {
  state: AutosaveState;
  /** The user's design, kept as it is. */
  mine: unknown;
  onReload: () => void;
  onSaveAsCopy: () => void;
}

/** Shown on a 409: what the other save changed against this edit, and the two ways out. */
export function ConflictNotice({ state, mine, onReload, onSaveAsCopy }: Props) {
  if (state.status !== 'conflict' || !state.conflict) return null;
  const theirs = state.conflict.current as BoardDetail;
  return (
    <section role="alert" aria-labelledby="conflict-heading" className="space-y-2 rounded border border-caution bg-caution-light p-3">
      <h2 id="conflict-heading" className="font-semibold">This board was saved elsewhere while you edited it</h2>
      <p className="text-sm">Your edit is kept here and has not been saved. Compare, then keep yours as a copy or load the saved one.</p>
      <DesignChanges before={theirs.design} after={mine} beforeLabel={`Saved (revision ${theirs.revision})`} afterLabel="Your edit" />
      <div className="flex gap-2">
        <button type="button" className="rounded border border-paper-line bg-white px-2 py-1 text-sm" onClick={onSaveAsCopy}>Save mine as a copy</button>
        <button type="button" className="rounded border border-paper-line bg-white px-2 py-1 text-sm" onClick={onReload}>Load the saved board</button>
      </div>
    </section>
  );
}
