import { useCallback, useEffect, useState, type FormEvent } from 'react';
import { NOTE_MAX_CHARS, type BoardDetail, type BoardRevision, type RevisionReason } from '~/lib/schemas/board.ts';
import { DesignChanges } from './DesignChanges.tsx';
import { BoardRequestError, fetchRevisions, restoreBoardRevision, saveBoardRevision } from './board-requests.ts';

interface Props {
  boardId: number;
  /** The board version the editor has, named by a restore so it cannot overwrite a newer save. */
  version: number;
  /** The board's newest revision; a change reloads the list. */
  currentRevision: number;
  /** The revision the working copy equals; null while it has changes not yet in a revision. */
  workingRevision: number | null;
  /** The editor has edits not yet autosaved: saving a revision waits for them. */
  unsavedEdits: boolean;
  onRestored: (board: BoardDetail) => void;
  /** A revision was kept (the board's revision numbers changed; its design did not). */
  onRevisionSaved: (board: BoardDetail) => void;
}

/** Why a revision exists, in words. */
const REASON_WORDS: Readonly<Record<RevisionReason, string>> = {
  saved: 'saved',
  created: 'first revision',
  proof: 'sent in a proof',
  export: 'made for an export',
  imported: 'imported',
  restored: 'restored',
  autosave: 'autosaved (before checkpoints)',
};

const button = 'rounded border border-paper-line bg-white px-2 py-0.5 text-sm disabled:opacity-50';

/**
 * Revision history: "Save revision" (a checkpoint with a note), every revision with why it was
 * made and its fingerprint, a field-by-field compare of any two, and restore (which asks first
 * when it would move an approved board off its approved layout).
 */
export function RevisionHistory({ boardId, version, currentRevision, workingRevision, unsavedEdits, onRestored, onRevisionSaved }: Props) {
  const [revisions, setRevisions] = useState<BoardRevision[] | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [pair, setPair] = useState<[number, number] | null>(null);
  const [restoring, setRestoring] = useState<number | null>(null);
  const [askRestore, setAskRestore] = useState<{ revision: number; message: string } | null>(null);
  const [note, setNote] = useState('');
  const [keeping, setKeeping] = useState(false);

  const load = useCallback(() => {
    setError(null);
    fetchRevisions(boardId).then(
      (items) => {
        setRevisions(items);
        setPair(items.length > 1 ? [items[1]!.revision, items[0]!.revision] : null);
      },
      (e: unknown) => setError(e instanceof Error ? e.message : 'Could not load the revisions'),
    );
  }, [boardId]);
  useEffect(load, [load, currentRevision]);

  const restore = async (revision: number, confirmApprovalChange = false) => {
    setRestoring(revision);
    setAskRestore(null);
    try {
      onRestored(await restoreBoardRevision(boardId, revision, version, confirmApprovalChange));
    } catch (e) {
      if (e instanceof BoardRequestError && e.body.code === 'approval_change') setAskRestore({ revision, message: e.message });
      else setError(e instanceof Error ? e.message : 'The restore failed');
    } finally {
      setRestoring(null);
    }
  };

  const keep = async (event: FormEvent) => {
    event.preventDefault();
    setKeeping(true);
    try {
      onRevisionSaved(await saveBoardRevision(boardId, version, note.trim()));
      setNote('');
    } catch (e) {
      setError(e instanceof Error ? e.message : 'The revision was not saved');
    } finally {
      setKeeping(false);
    }
  };

  if (error) return <div role="alert" className="text-sm text-rosewood">{error} <button type="button" className={button} onClick={load}>Try again</button></div>;
  if (!revisions) return <p role="status" className="text-sm">Loading revisions…</p>;
  const byNumber = (n: number) => revisions.find((r) => r.revision === n);
  const [a, b] = pair ? [byNumber(pair[0]), byNumber(pair[1])] : [undefined, undefined];
  const pick = (index: 0 | 1) => (e: React.ChangeEvent<HTMLSelectElement>) =>
    setPair((p) => {
      const next: [number, number] = p ? [...p] : [currentRevision, currentRevision];
      next[index] = Number(e.target.value);
      return next;
    });

  return (
    <section aria-labelledby="revisions-heading" className="space-y-3">
      <h2 id="revisions-heading" className="font-semibold">Revision history</h2>
      <form onSubmit={(e) => void keep(e)} className="flex flex-wrap items-end gap-2 text-sm" aria-label="Save a revision">
        <p className="w-full text-ink-soft">
          {workingRevision === null
            ? 'The working copy has changes not yet in a revision. Autosave keeps them safe; save a revision to keep this point in the history.'
            : `The working copy is revision ${workingRevision}.`}
        </p>
        <label className="flex flex-col">
          Revision note (optional)
          <input type="text" className={button} value={note} maxLength={NOTE_MAX_CHARS} onChange={(e) => setNote(e.target.value)} />
        </label>
        <button type="submit" className={button} disabled={keeping || unsavedEdits || workingRevision !== null}>
          {keeping ? 'Saving the revision…' : 'Save revision'}
        </button>
      </form>
      {askRestore && (
        <div role="alertdialog" aria-labelledby="restore-question" className="space-y-2 rounded border border-caution bg-caution-light p-2 text-sm">
          <p id="restore-question">{askRestore.message}.</p>
          <div className="flex gap-2">
            <button type="button" className={button} onClick={() => void restore(askRestore.revision, true)}>Restore revision {askRestore.revision} anyway</button>
            <button type="button" className={button} onClick={() => setAskRestore(null)}>Cancel</button>
          </div>
        </div>
      )}
      <ol className="space-y-1 text-sm">
        {revisions.map((r) => (
          <li key={r.revision} className="flex flex-wrap items-center gap-2">
            <span className="font-mono">#{r.revision}</span>
            <time dateTime={r.createdAt}>{new Date(r.createdAt).toLocaleString()}</time>
            <span>{r.authorName}</span>
            <span className="text-ink-soft">{REASON_WORDS[r.reason]}</span>
            <span className="font-mono text-xs" title="Fingerprint of this revision's layout, as printed on its exports">{r.fingerprint}</span>
            {r.note && <span className="text-ink-soft">“{r.note}”</span>}
            {r.revision === workingRevision ? (
              <span className="text-xs text-spruce">working copy</span>
            ) : (
              <button type="button" className={button} disabled={restoring !== null} onClick={() => void restore(r.revision)}>
                {restoring === r.revision ? 'Restoring…' : `Restore revision ${r.revision}`}
              </button>
            )}
          </li>
        ))}
      </ol>
      {revisions.length > 1 && pair && (
        <div className="space-y-2">
          <div className="flex gap-3 text-sm">
            {([0, 1] as const).map((index) => (
              <label key={index} className="flex items-center gap-1">
                {index === 0 ? 'Compare revision' : 'with revision'}
                <select className={button} value={pair[index]} onChange={pick(index)}>
                  {revisions.map((r) => <option key={r.revision} value={r.revision}>{r.revision}</option>)}
                </select>
              </label>
            ))}
          </div>
          {a && b && <DesignChanges before={a.design} after={b.design} beforeLabel={`Revision ${a.revision}`} afterLabel={`Revision ${b.revision}`} />}
        </div>
      )}
    </section>
  );
}
