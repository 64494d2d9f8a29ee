/**
 * The Template shelf: the shop's physical index templates as a table fetched from the API, with
 * search, a condition filter, sortable columns and pages; plus the form to add a template.
 */
import { QueryClient, QueryClientProvider, keepPreviousData, useQuery } from '@tanstack/react-query';
import { createColumnHelper, flexRender, getCoreRowModel, useReactTable, type SortingState } from '@tanstack/react-table';
import { useState } from 'react';
import { formatLength } from '~/lib/format/units';
import { TEMPLATE_SORTS, type TemplateView } from '~/lib/schemas/template';
import { AddTemplateForm, type DesignChoice } from './AddTemplateForm';
import { CONDITION_LABELS, ConditionOptions, LastCheck } from './template-labels';
import { fetchTemplates } from './shelf-api';
import { useHydrated } from '~/components/ui/use-hydrated.ts';

const queryClient = new QueryClient({ defaultOptions: { queries: { retry: 1, staleTime: 5_000 } } });

interface ShelfProps {
  designs: DesignChoice[];
  /** From the page's ?q=, so a search can be linked to. */
  initialSearch: string;
}

const column = createColumnHelper<TemplateView>();
const SORTABLE = new Set<string>(TEMPLATE_SORTS);

function scaleText(t: TemplateView): string {
  return t.trebleScale === t.bassScale
    ? formatLength(t.trebleScale, t.units, true)
    : `${formatLength(t.trebleScale, t.units)}–${formatLength(t.bassScale, t.units, true)}`;
}

const columns = [
  column.accessor('name', {
    id: 'name',
    header: 'Name',
    cell: (info) => <a href={`/templates/${info.row.original.id}`}>{info.getValue()}</a>,
  }),
  column.display({
    id: 'source',
    header: 'Made from',
    cell: ({ row }) =>
      row.original.designId !== null ? `${row.original.designName ?? 'design'} (rev. ${row.original.revision})` : 'typed scale lengths',
  }),
  column.display({ id: 'scale', header: 'Scale', cell: ({ row }) => <span className="font-mono">{scaleText(row.original)}</span> }),
  column.accessor('frets', { header: 'Frets', enableSorting: false, cell: (info) => <span className="font-mono">{info.getValue()}</span> }),
  column.display({
    id: 'widths',
    header: 'Slot / key width',
    cell: ({ row }) => (
      <span className="font-mono">
        {formatLength(row.original.slotWidth, row.original.units)} / {formatLength(row.original.keyWidth, row.original.units, true)}
      </span>
    ),
  }),
  column.accessor('material', { header: 'Material', enableSorting: false }),
  column.accessor('storagePlace', { header: 'Stored at', enableSorting: false }),
  column.accessor('condition', { header: 'Condition', enableSorting: false, cell: (info) => CONDITION_LABELS[info.getValue()] }),
  column.accessor('madeOn', {
    id: 'madeOn',
    header: 'Made on',
    cell: (info) => <span className="font-mono">{info.getValue() ?? '—'}</span>,
  }),
  column.display({ id: 'lastChecked', header: 'Last check', cell: ({ row }) => <LastCheck template={row.original} /> }),
];

function Shelf({ designs, initialSearch }: ShelfProps) {
  const hydrated = useHydrated();
  const [search, setSearch] = useState(initialSearch);
  const [condition, setCondition] = useState('');
  const [sorting, setSorting] = useState<SortingState>([{ id: 'name', desc: false }]);
  const [page, setPage] = useState(1);
  const pageSize = 20;
  const params = new URLSearchParams({ page: String(page), pageSize: String(pageSize) });
  if (search.trim()) params.set('q', search.trim());
  if (condition) params.set('condition', condition);
  const sort = sorting[0];
  if (sort && SORTABLE.has(sort.id)) {
    params.set('sort', sort.id);
    params.set('dir', sort.desc ? 'desc' : 'asc');
  }
  const query = useQuery({
    queryKey: ['templates', params.toString()],
    queryFn: () => fetchTemplates(params),
    placeholderData: keepPreviousData,
  });
  const table = useReactTable({
    data: query.data?.items ?? [],
    columns,
    state: { sorting },
    onSortingChange: (updater) => {
      setSorting(updater);
      setPage(1);
    },
    manualSorting: true,
    enableSortingRemoval: false,
    getCoreRowModel: getCoreRowModel(),
  });
  const total = query.data?.total ?? 0;
  const pages = Math.max(1, Math.ceil(total / pageSize));

  return (
    <div className="space-y-4">
      <fieldset disabled={!hydrated} className="flex flex-wrap items-end gap-4">
        <legend className="sr-only">Find templates</legend>
        <label className="flex flex-col text-sm">
          Search
          <input
            type="search"
            value={search}
            onChange={(e) => {
              setSearch(e.target.value);
              setPage(1);
            }}
            placeholder="name, material, place, notes"
            className="rounded border border-paper-line px-2 py-1"
          />
        </label>
        <label className="flex flex-col text-sm">
          Condition
          <select
            value={condition}
            onChange={(e) => {
              setCondition(e.target.value);
              setPage(1);
            }}
            className="rounded border border-paper-line px-2 py-1"
          >
            <option value="">Any</option>
            <ConditionOptions />
          </select>
        </label>
        <p className="text-sm text-ink-soft" aria-live="polite">
          {!hydrated || query.isFetching ? 'Loading…' : `${total} template${total === 1 ? '' : 's'}`}
        </p>
      </fieldset>
      {query.isError && (
        <p role="alert" className="text-rosewood">
          {(query.error as Error).message}
        </p>
      )}
      <div className="overflow-x-auto rounded border border-paper-line bg-white">
        <table className="w-full text-left text-sm">
          <caption className="sr-only">Template shelf</caption>
          <thead className="bg-paper-shade">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => {
                  const sortable = SORTABLE.has(header.column.id);
                  const direction = header.column.getIsSorted();
                  return (
                    <th
                      key={header.id}
                      scope="col"
                      className="px-2 py-2 font-semibold"
                      aria-sort={direction === 'asc' ? 'ascending' : direction === 'desc' ? 'descending' : undefined}
                    >
                      {sortable ? (
                        <button
                          type="button"
                          onClick={header.column.getToggleSortingHandler()}
                          className="underline-offset-2 hover:underline"
                        >
                          {flexRender(header.column.columnDef.header, header.getContext())}
                          {direction === 'asc' ? ' ▲' : direction === 'desc' ? ' ▼' : ''}
                        </button>
                      ) : (
                        flexRender(header.column.columnDef.header, header.getContext())
                      )}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody>
            {table.getRowModel().rows.map((row) => (
              <tr key={row.id} className="border-t border-paper-line">
                {row.getVisibleCells().map((cell) => (
                  <td key={cell.id} className="px-2 py-2 align-top">
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
                  </td>
                ))}
              </tr>
            ))}
            {query.isSuccess && total === 0 && (
              <tr>
                <td colSpan={columns.length} className="px-2 py-4 text-ink-soft">
                  No templates match. Add one below.
                </td>
              </tr>
            )}
          </tbody>
        </table>
      </div>
      <nav aria-label="Pages" className="flex items-center gap-3 text-sm">
        <button
          type="button"
          disabled={page <= 1}
          onClick={() => setPage((p) => p - 1)}
          className="rounded border border-paper-line px-2 py-1 disabled:opacity-40"
        >
          Previous
        </button>
        <span>
          Page {page} of {pages}
        </span>
        <button
          type="button"
          disabled={page >= pages}
          onClick={() => setPage((p) => p + 1)}
          className="rounded border border-paper-line px-2 py-1 disabled:opacity-40"
        >
          Next
        </button>
      </nav>
      <AddTemplateForm designs={designs} />
    </div>
  );
}

export default function TemplateShelf(props: ShelfProps) {
  return (
    <QueryClientProvider client={queryClient}>
      <Shelf {...props} />
    </QueryClientProvider>
  );
}
