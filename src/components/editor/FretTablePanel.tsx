/**
 * The Fret table: the same rows and numbers as the CSV (src/lib/export/csv.ts), shown rounded to
 * 0.01 mm / 0.001 in, sortable by any column. Copy and download carry the unrounded CSV, written
 * here by the same shared code that writes the server's (POST /api/layout?format=csv). A browser's
 * Math.pow may differ from the server's in the last bit (about 1e-13 mm), far below the 0.001 mm
 * any rule reads; the machine exports (PDF, DXF, SVG) are still made on the server.
 */
import {
  createColumnHelper,
  flexRender,
  getCoreRowModel,
  getSortedRowModel,
  useReactTable,
  type SortingState,
} from '@tanstack/react-table';
import { memo, useMemo, useState } from 'react';
import { scaleConventionWords } from '~/lib/format/design-specs.ts';
import { formatLength } from '~/lib/format/units.ts';
import { fretTableCsv, fretTableRows, type FretTableRow } from '~/lib/export/csv.ts';
import { exportFileName } from '~/lib/export/file-name.ts';
import type { Layout } from '~/lib/geometry/layout.ts';
import type { Design } from '~/lib/schemas/design.ts';
import { BUTTON } from './control-styles.ts';

const column = createColumnHelper<FretTableRow>();

interface Props {
  layout: Layout;
  design: Design;
  /** A saved board's download comes from the server, named after its revision (exports make one for unsaved changes). */
  boardId?: number | null;
  /** Copy and download (left out on a client's proof page). */
  downloads?: boolean;
}

/** Memoised: the table is large and only changes with the (deferred) layout. */
export const FretTablePanel = memo(function FretTablePanel({ layout, design, boardId = null, downloads = true }: Props) {
  const units = layout.units;
  const [sorting, setSorting] = useState<SortingState>([]);
  const [notice, setNotice] = useState('');
  const rows = useMemo(() => fretTableRows(layout), [layout]);
  const columns = useMemo(() => {
    const length = (value: number) => formatLength(value, units);
    return [
      column.accessor('fret', { header: 'Fret' }),
      column.accessor('string', { header: 'String' }),
      column.accessor('scaleLength', { header: `Scale length (${units})`, cell: (c) => length(c.getValue()) }),
      column.accessor('fromNut', { header: `From nut (${units})`, cell: (c) => length(c.getValue()) }),
      column.accessor('fromPrevious', { header: `From previous (${units})`, cell: (c) => length(c.getValue()) }),
      column.accessor('x', { header: `x (${units})`, cell: (c) => length(c.getValue()) }),
      column.accessor('y', { header: `y (${units})`, cell: (c) => length(c.getValue()) }),
    ];
  }, [units]);
  const table = useReactTable({
    data: rows,
    columns,
    state: { sorting },
    onSortingChange: setSorting,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
  });

  const copy = async () => {
    try {
      await navigator.clipboard.writeText(fretTableCsv(layout));
      setNotice('Fret table copied as CSV.');
    } catch (error) {
      setNotice(`Not copied: ${error instanceof Error ? error.message : String(error)}`);
    }
  };
  const download = () => {
    const url = URL.createObjectURL(new Blob([fretTableCsv(layout)], { type: 'text/csv;charset=utf-8' }));
    const link = document.createElement('a');
    link.href = url;
    link.download = exportFileName(design.name, 'csv');
    link.click();
    setTimeout(() => URL.revokeObjectURL(url), 0);
    setNotice('Fret table downloaded as CSV.');
  };

  return (
    <div className="space-y-2">
      {downloads && (
        <div className="flex flex-wrap items-center gap-2">
          <button type="button" className={BUTTON} onClick={() => void copy()}>Copy CSV</button>
          {boardId === null ? (
            <button type="button" className={BUTTON} onClick={download}>Download CSV</button>
          ) : (
            <a className={`${BUTTON} no-underline`} href={`/api/boards/${boardId}/export?format=csv`} download>Download CSV</a>
          )}
          <span className="text-xs text-ink-soft" role="status">{notice}</span>
        </div>
      )}
      <p className="text-xs text-ink-soft">
        Distances along each string from its nut end (uncompensated); x and y in board coordinates from where
        the nut line crosses the centre line. The design gives its {scaleConventionWords(layout.scaleAlong)}.
        {downloads && ' Shown rounded; the CSV carries the unrounded numbers.'}
      </p>
      <div className="relative max-h-80 overflow-auto rounded border border-paper-line bg-white">
        <table className="w-full font-mono text-xs" aria-label="Fret table">
          <thead className="sticky top-0 bg-paper-shade">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => {
                  const sorted = header.column.getIsSorted();
                  return (
                    <th
                      key={header.id}
                      scope="col"
                      className="px-2 py-1 text-right font-sans font-semibold"
                      aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : 'none'}
                    >
                      <button type="button" className="underline-offset-2 hover:underline" onClick={header.column.getToggleSortingHandler()}>
                        {flexRender(header.column.columnDef.header, header.getContext())}
                        {sorted === 'asc' ? ' ▲ (ascending)' : sorted === 'desc' ? ' ▼ (descending)' : ''}
                      </button>
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody>
            {table.getRowModel().rows.map((row) => (
              <tr key={row.id} className="odd:bg-paper">
                {row.getVisibleCells().map((cell) => (
                  <td key={cell.id} className="px-2 py-0.5 text-right">
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
});
