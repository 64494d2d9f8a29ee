import { useCallback, useEffect, useState } from 'react';
import type { BoardDetail, BoardRevision } from '~/lib/schemas/board.ts';
import { DesignChanges } from './DesignChanges.tsx';
import { fetchRevisions, restoreBoardRevision } from './board-requests.ts';

interface Props {
  boardId: number;
  /** The board version the editor has, named by a restore so it cannot overwrite a newer save. */
  version: number;
  /** The board's current revision; a change reloads the list. */
  currentRevision: number;
  onRestored: (board: BoardDetail) => void;
}

const button = 'rounded border border-paper-line bg-white px-2 py-0.5 text-sm disabled:opacity-50';

/** Revision history: every revision, a field-by-field compare of any two, and restore. */
export function RevisionHistory({ boardId, version, currentRevision, onRestored }: Props) {
  const [revisions, setRevisions] = useState<BoardRevision[] | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [pair, setPair] = useState<[number, number] | null>(null);
  const [restoring, setRestoring] = useState<number | null>(null);

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

  const restore = async (revision: number) => {
    setRestoring(revision);
    try {
      onRestored(await restoreBoardRevision(boardId, revision, version));
    } catch (e) {
      setError(e instanceof Error ? e.message : 'The restore failed');
    } finally {
      setRestoring(null);
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
      <ol className="space-y-1 text-sm">
        {revisions.map((r) => (
          <li key={r.revision} className="flex flex-wrap items-center gap-2">
            <span className="font-mono">#{r.revision}</span>
            <time dateTime={r.createdAt}>{new Date(r.createdAt).toLocaleString()}</time>
            <span>{r.authorName}</span>
            {r.note && <span className="text-ink-soft">“{r.note}”</span>}
            {r.revision === currentRevision ? (
              <span className="text-xs text-spruce">current</span>
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
