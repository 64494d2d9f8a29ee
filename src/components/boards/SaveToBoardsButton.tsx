import { useState } from 'react';
import type { BoardDetail } from '~/lib/schemas/board.ts';
import { BoardRequestError, createBoard } from './board-requests.ts';

interface Props {
  /** The scratch design the editor has now. */
  design: unknown;
  onSaved: (board: BoardDetail) => void;
}

/** "Save to Boards" for a design not saved yet; a rejected design shows the failing field. */
export function SaveToBoardsButton({ design, onSaved }: Props) {
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const save = async () => {
    setBusy(true);
    setError(null);
    try {
      onSaved(await createBoard(design));
    } catch (e) {
      setError(e instanceof BoardRequestError || e instanceof Error ? e.message : 'The save failed');
    } finally {
      setBusy(false);
    }
  };
  return (
    <span className="inline-flex items-center gap-2">
      <button type="button" className="rounded bg-spruce px-3 py-1 text-sm text-white disabled:opacity-50" disabled={busy} onClick={() => void save()}>
        {busy ? 'Saving…' : 'Save to Boards'}
      </button>
      {error && <span role="alert" className="text-sm text-rosewood">{error}</span>}
    </span>
  );
}
