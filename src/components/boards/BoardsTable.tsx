import { keepPreviousData, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { createColumnHelper, flexRender, getCoreRowModel, useReactTable } from '@tanstack/react-table';
import { useEffect, useMemo, useState } from 'react';
import { defaultDirection, type BoardListQuery, type BoardSort, type BoardSummary } from '~/lib/schemas/board.ts';
import { INSTRUMENT_LABELS, scaleText, STATUS_LABELS } from './board-labels.ts';
import { archiveBoard, duplicateBoard, fetchBoards } from './board-requests.ts';
import { RevisionHistory } from './RevisionHistory.tsx';

interface Props {
  query: BoardListQuery;
  onChange: (change: Partial<BoardListQuery>) => void;
}

const column = createColumnHelper<BoardSummary>();
const STATUS_TONES: Readonly<Record<BoardSummary['status'], string>> = {
  draft: 'border-paper-line bg-white text-ink',
  shared: 'border-paper-line bg-paper-shade text-ink',
  approved: 'border-spruce bg-spruce-light text-spruce-dark',
  changes_requested: 'border-caution bg-caution-light text-caution',
  changed_since_approval: 'border-caution bg-caution-light text-caution',
  archived: 'border-paper-line bg-paper-shade text-ink-soft',
};
const button = 'rounded border border-paper-line bg-white px-2 py-0.5 text-sm hover:bg-paper-shade disabled:opacity-50';

/** How long the "Archived … Undo" notice stays, in milliseconds. */
const UNDO_MS = 10_000;

function RowActions({ board, onHistory, onArchived }: { board: BoardSummary; onHistory: () => void; onArchived: (board: BoardSummary) => void }) {
  const client = useQueryClient();
  const refresh = () => client.invalidateQueries({ queryKey: ['boards'] });
  const duplicate = useMutation({ mutationFn: () => duplicateBoard(board.id), onSuccess: refresh });
  const archiving = board.status !== 'archived';
  const archive = useMutation({
    mutationFn: () => archiveBoard(board.id, archiving),
    onSuccess: () => {
      if (archiving) onArchived(board);
      return refresh();
    },
  });
  const failed = duplicate.error ?? archive.error;
  return (
    <div className="flex flex-wrap items-center gap-2">
      <a className={`${button} no-underline`} href={`/layout?board=${board.id}`} aria-label={`Open ${board.name}`}>Open</a>
      <a className={`${button} no-underline`} href={`/boards/${board.id}/check`} aria-label={`Check a template against ${board.name}`}>Check a template</a>
      <button type="button" className={button} disabled={duplicate.isPending} onClick={() => duplicate.mutate()} aria-label={`Duplicate ${board.name}`}>
        {duplicate.isPending ? 'Duplicating…' : 'Duplicate'}
      </button>
      <a className={`${button} no-underline`} href={`/api/boards/${board.id}/export?format=json`} download aria-label={`Export JSON of ${board.name}`}>Export JSON</a>
      <button type="button" className={button} onClick={onHistory} aria-label={`History of ${board.name}`}>History</button>
      <button type="button" className={button} disabled={archive.isPending} onClick={() => archive.mutate()}
        aria-label={`${board.status === 'archived' ? 'Unarchive' : 'Archive'} ${board.name}`}>
        {board.status === 'archived' ? 'Unarchive' : 'Archive'}
      </button>
      {failed && <span role="alert" className="text-rosewood">{failed.message}</span>}
    </div>
  );
}

function SortHeader({ label, sort, query, onChange }: { label: string; sort: BoardSort } & Props) {
  const active = query.sort === sort;
  const dir = query.dir ?? defaultDirection(query.sort);
  const next = active ? (dir === 'asc' ? 'desc' : 'asc') : defaultDirection(sort);
  return (
    <button type="button" className="font-semibold underline decoration-dotted" onClick={() => onChange({ sort, dir: next, page: 1 })}>
      {label}{active ? (dir === 'asc' ? ' ▲' : ' ▼') : ''}
    </button>
  );
}

/** The Boards table: fetched from the API in the browser, sorted and paged on the server. */
/** After archiving: the board's name and an Undo button for 10 s (the Archived filter brings it back later too). */
function UndoArchive({ board, onDone }: { board: BoardSummary; onDone: () => void }) {
  const client = useQueryClient();
  const undo = useMutation({
    mutationFn: () => archiveBoard(board.id, false),
    onSuccess: async () => {
      await client.invalidateQueries({ queryKey: ['boards'] });
      onDone();
    },
  });
  useEffect(() => {
    const timer = setTimeout(onDone, UNDO_MS);
    return () => clearTimeout(timer);
  }, [onDone]);
  return (
    <div role="status" className="flex items-center gap-3 rounded border border-paper-line bg-white p-2 text-sm shadow">
      <span>Archived “{board.name}”. Find it again with Status: Archived.</span>
      <button type="button" className={button} disabled={undo.isPending} onClick={() => undo.mutate()}>Undo</button>
      {undo.error && <span role="alert" className="text-rosewood">{undo.error.message}</span>}
    </div>
  );
}

export function BoardsTable({ query, onChange }: Props) {
  const client = useQueryClient();
  const [historyId, setHistoryId] = useState<number | null>(null);
  const [archived, setArchived] = useState<BoardSummary | null>(null);
  const clearArchived = useMemo(() => () => setArchived(null), []);
  const boards = useQuery({ queryKey: ['boards', query], queryFn: () => fetchBoards(query), placeholderData: keepPreviousData });
  const columns = useMemo(
    () => [
      column.display({
        id: 'drawing',
        header: 'Drawing',
        cell: ({ row: { original: b } }) => (
          <img src={`/api/boards/${b.id}/thumbnail.svg?revision=${b.currentRevision}`} alt={`Drawing of ${b.name}`} width={240} height={48} loading="lazy" />
        ),
      }),
      column.accessor('name', {
        header: () => <SortHeader label="Name" sort="name" query={query} onChange={onChange} />,
        cell: ({ row: { original: b } }) => <a href={`/layout?board=${b.id}`}>{b.name}</a>,
      }),
      column.accessor('clientName', { header: 'Client', cell: (c) => c.getValue() || '—' }),
      column.accessor('instrumentType', { header: 'Instrument', cell: (c) => INSTRUMENT_LABELS[c.getValue() as keyof typeof INSTRUMENT_LABELS] ?? c.getValue() }),
      column.display({
        id: 'scale',
        header: () => <SortHeader label="Scale length" sort="scale" query={query} onChange={onChange} />,
        cell: ({ row: { original: b } }) => <span className="font-mono">{scaleText(b)}</span>,
      }),
      column.accessor('status', {
        header: 'Status',
        // In words (never by colour alone); a proof's answer shows here as soon as the client gives it.
        cell: ({ row: { original: b } }) => (
          <span className="flex flex-col items-start gap-0.5">
            <span data-label="status" data-status={b.status} className={`rounded border px-1.5 py-0.5 text-xs ${STATUS_TONES[b.status]}`}>{STATUS_LABELS[b.status]}</span>
            {b.status !== 'draft' && b.status !== 'archived' && (
              <a className="text-xs" href={`/boards/${b.id}/proofs`} aria-label={`Proofs of ${b.name}`}>Proofs</a>
            )}
          </span>
        ),
      }),
      column.accessor('updatedAt', {
        header: () => <SortHeader label="Last changed" sort="updated" query={query} onChange={onChange} />,
        cell: (c) => <time dateTime={c.getValue()}>{new Date(c.getValue()).toLocaleString()}</time>,
      }),
      column.display({
        id: 'actions',
        header: 'Actions',
        cell: ({ row }) => <RowActions board={row.original} onHistory={() => setHistoryId(row.original.id)} onArchived={setArchived} />,
      }),
    ],
    [query, onChange],
  );
  const table = useReactTable({
    data: boards.data?.items ?? [],
    columns,
    getCoreRowModel: getCoreRowModel(),
    manualSorting: true,
    manualPagination: true,
    getRowId: (b) => String(b.id),
  });

  if (boards.isPending) return <p role="status">Loading boards…</p>;
  if (boards.isError) {
    return (
      <div role="alert" className="rounded border border-rosewood bg-rosewood-light p-3 text-sm">
        Boards could not be loaded: {boards.error.message}{' '}
        <button type="button" className={button} onClick={() => boards.refetch()}>Try again</button>
      </div>
    );
  }
  const { total, pageSize } = boards.data;
  const pages = Math.max(1, Math.ceil(total / pageSize));
  const historyBoard = boards.data.items.find((b) => b.id === historyId);
  const undo = archived && <UndoArchive key={archived.id} board={archived} onDone={clearArchived} />;
  if (total === 0) {
    return <div className="space-y-3">{undo}<p role="status" className="rounded border border-paper-line bg-white p-3 text-sm">{query.q || query.instrument || query.units || query.status !== 'active' ? 'No boards match these filters.' : 'No saved boards yet. Save a design from Layout, or import a JSON file.'}</p></div>;
  }
  return (
    <div className="space-y-3">
      {undo}
      <div className="overflow-x-auto">
        <table className="w-full border-collapse text-left text-sm" aria-busy={boards.isFetching}>
          <caption className="sr-only">Saved boards</caption>
          <thead>
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id} className="border-b border-paper-line">
                {group.headers.map((h) => (
                  <th key={h.id} scope="col" className="px-2 py-2"
                    aria-sort={h.id === sortColumn(query.sort) ? ((query.dir ?? defaultDirection(query.sort)) === 'asc' ? 'ascending' : 'descending') : undefined}>
                    {flexRender(h.column.columnDef.header, h.getContext())}
                  </th>
                ))}
              </tr>
            ))}
          </thead>
          <tbody>
            {table.getRowModel().rows.map((row) => (
              <tr key={row.id} className="border-b border-paper-line align-middle">
                {row.getVisibleCells().map((cell) => (
                  <td key={cell.id} className="px-2 py-2">{flexRender(cell.column.columnDef.cell, cell.getContext())}</td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {historyBoard && (
        <div className="rounded border border-paper-line bg-white p-3">
          <div className="mb-2 flex items-center justify-between">
            <p className="text-sm">History of <strong>{historyBoard.name}</strong></p>
            <button type="button" className={button} onClick={() => setHistoryId(null)}>Close history</button>
          </div>
          <RevisionHistory boardId={historyBoard.id} version={historyBoard.version} currentRevision={historyBoard.currentRevision}
            workingRevision={historyBoard.workingRevision} unsavedEdits={false}
            onRestored={() => client.invalidateQueries({ queryKey: ['boards'] })}
            onRevisionSaved={() => client.invalidateQueries({ queryKey: ['boards'] })} />
        </div>
      )}
      <nav aria-label="Pages" className="flex items-center gap-3 text-sm">
        <button type="button" className={button} disabled={query.page <= 1} onClick={() => onChange({ page: query.page - 1 })}>Previous page</button>
        <span>Page {query.page} of {pages} · {total} {total === 1 ? 'board' : 'boards'}</span>
        <button type="button" className={button} disabled={query.page >= pages} onClick={() => onChange({ page: query.page + 1 })}>Next page</button>
        <label className="ml-auto flex items-center gap-2">
          Per page
          <select className={button} value={pageSize} onChange={(e) => onChange({ pageSize: Number(e.target.value), page: 1 })}>
            {[10, 25, 50, 100].map((n) => <option key={n} value={n}>{n}</option>)}
          </select>
        </label>
      </nav>
    </div>
  );
}

function sortColumn(sort: BoardSort): string {
  return sort === 'updated' ? 'updatedAt' : sort;
}
