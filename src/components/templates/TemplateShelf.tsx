/**
 * The Template shelf: the shop's physical index templates as a table fetched from the API, with
 * search, condition and last-check filters, sortable columns and pages, all kept in the page URL
 * (Back and Forward restore a view); plus the form to add a template.
 */
import { QueryClient, QueryClientProvider, keepPreviousData, useQuery } from '@tanstack/react-query';
import { createColumnHelper, flexRender, getCoreRowModel, useReactTable } from '@tanstack/react-table';
import { useCallback, useEffect, useState } from 'react';
import { listQueryFromSearch, searchFromListQuery } from '~/components/ui/list-url-state.ts';
import { formatLength } from '~/lib/format/units.ts';
import { LAST_RESULT_FILTERS, TEMPLATE_SORTS, templateListQuerySchema, type TemplateListQuery, type TemplateSort, type TemplateView } from '~/lib/schemas/template.ts';
import { AddTemplateForm, type BoardChoice } from './AddTemplateForm.tsx';
import { CONDITION_LABELS, ConditionOptions, LAST_RESULT_LABELS, LastCheck } from './template-labels.tsx';
import { fetchTemplates } from './shelf-api.ts';
import { useHydrated } from '~/components/ui/use-hydrated.ts';

const queryClient = new QueryClient({ defaultOptions: { queries: { retry: 1, staleTime: 5_000 } } });

interface ShelfProps {
  boards: BoardChoice[];
  /** The page URL's search string when it was served, so the first render matches the URL. */
  initialSearch: string;
}

const control = 'rounded border border-paper-line px-2 py-1';
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
      row.original.boardId !== null ? `${row.original.boardName ?? 'design'} (rev. ${row.original.revision})` : 'typed scale lengths',
  }),
  column.display({ id: 'scale', header: 'Scale', cell: ({ row }) => <span className="font-mono">{scaleText(row.original)}</span> }),
  column.accessor('frets', { header: 'Frets', cell: (info) => <span className="font-mono">{info.getValue()}</span> }),
  column.display({
    id: 'widths',
    header: 'Slot / key width',
    cell: ({ row }) => (
      <span className="font-mono">
        {formatLength(row.original.slotWidth, row.original.units)} / {formatLength(row.original.keyWidth, row.original.units, true)}
      </span>
    ),
  }),
  column.accessor('material', { header: 'Material' }),
  column.accessor('storagePlace', { header: 'Stored at' }),
  column.accessor('condition', { header: 'Condition', cell: (info) => CONDITION_LABELS[info.getValue()] }),
  column.accessor('madeOn', {
    id: 'madeOn',
    header: 'Made on',
    cell: (info) => <span className="font-mono">{info.getValue() ?? '—'}</span>,
  }),
  column.display({ id: 'lastChecked', header: 'Last check', cell: ({ row }) => <LastCheck template={row.original} /> }),
];

/** The shelf's own default order for a column the first time it is sorted by. */
const FIRST_DIRECTION: Record<TemplateSort, 'asc' | 'desc'> = { name: 'asc', scale: 'asc', madeOn: 'desc', lastChecked: 'desc', updated: 'desc' };
const SEARCH_DELAY_MS = 300;

function Shelf({ boards, initialSearch }: ShelfProps) {
  const hydrated = useHydrated();
  const [query, setQuery] = useState(() => listQueryFromSearch(templateListQuerySchema, initialSearch));
  const [search, setSearch] = useState(query.q);

  useEffect(() => {
    const onPop = () => setQuery(listQueryFromSearch(templateListQuerySchema, window.location.search));
    window.addEventListener('popstate', onPop);
    return () => window.removeEventListener('popstate', onPop);
  }, []);

  const change = useCallback((partial: Partial<TemplateListQuery>) => {
    setQuery((current) => {
      const next = { ...current, ...partial };
      const url = searchFromListQuery(templateListQuerySchema, next);
      if (url !== window.location.search) window.history.pushState(null, '', `${window.location.pathname}${url}`);
      return next;
    });
  }, []);

  // The box follows the URL (Back/Forward); typing reaches the URL after a short pause.
  useEffect(() => setSearch(query.q), [query.q]);
  useEffect(() => {
    if (search.trim() === query.q) return;
    const timer = setTimeout(() => change({ q: search.trim(), page: 1 }), SEARCH_DELAY_MS);
    return () => clearTimeout(timer);
  }, [search, query.q, change]);

  const params = new URLSearchParams(searchFromListQuery(templateListQuerySchema, query));
  const data = useQuery({
    queryKey: ['templates', params.toString()],
    queryFn: () => fetchTemplates(params),
    placeholderData: keepPreviousData,
  });
  const table = useReactTable({ data: data.data?.items ?? [], columns, manualSorting: true, getCoreRowModel: getCoreRowModel() });
  const total = data.data?.total ?? 0;
  const pages = Math.max(1, Math.ceil(total / query.pageSize));

  function sortBy(sort: TemplateSort) {
    const dir = query.sort === sort ? (query.dir === 'asc' ? 'desc' : 'asc') : FIRST_DIRECTION[sort];
    change({ sort, dir, page: 1 });
  }

  return (
    <div className="space-y-4">
      <form role="search" onSubmit={(e) => { e.preventDefault(); change({ q: search.trim(), page: 1 }); }}>
        <fieldset disabled={!hydrated} className="flex flex-wrap items-end gap-4">
          <legend className="sr-only">Find templates</legend>
          <label className="flex flex-col text-sm">
            Search
            <input
              type="search"
              value={search}
              onChange={(e) => setSearch(e.target.value)}
              placeholder="name, design, material, place, notes"
              className={control}
            />
          </label>
          <label className="flex flex-col text-sm">
            Condition
            <select
              value={query.condition ?? ''}
              onChange={(e) => change({ condition: (e.target.value || undefined) as TemplateListQuery['condition'], page: 1 })}
              className={control}
            >
              <option value="">Any</option>
              <ConditionOptions />
            </select>
          </label>
          <label className="flex flex-col text-sm">
            Last check
            <select
              value={query.lastResult ?? ''}
              onChange={(e) => change({ lastResult: (e.target.value || undefined) as TemplateListQuery['lastResult'], page: 1 })}
              className={control}
            >
              <option value="">Any</option>
              {LAST_RESULT_FILTERS.map((value) => (
                <option key={value} value={value}>
                  {LAST_RESULT_LABELS[value]}
                </option>
              ))}
            </select>
          </label>
          <p className="text-sm text-ink-soft" aria-live="polite">
            {!hydrated || data.isFetching ? 'Loading…' : `${total} template${total === 1 ? '' : 's'}`}
          </p>
        </fieldset>
      </form>
      {data.isError && (
        <p role="alert" className="text-rosewood">
          {(data.error as Error).message}
        </p>
      )}
      <div className="overflow-x-auto rounded border border-paper-line bg-white">
        <table className="w-full text-left text-sm">
          <caption className="sr-only">Template shelf</caption>
          <thead className="bg-paper-shade">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => {
                  const id = header.column.id;
                  const sortable = SORTABLE.has(id) ? (id as TemplateSort) : null;
                  const direction = query.sort === id ? query.dir : null;
                  return (
                    <th
                      key={header.id}
                      scope="col"
                      className="px-2 py-2 font-semibold"
                      aria-sort={direction === 'asc' ? 'ascending' : direction === 'desc' ? 'descending' : undefined}
                    >
                      {sortable ? (
                        <button type="button" disabled={!hydrated} onClick={() => sortBy(sortable)} className="underline decoration-dotted">
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
            {data.isSuccess && total === 0 && (
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
          disabled={!hydrated || query.page <= 1}
          onClick={() => change({ page: query.page - 1 })}
          className="rounded border border-paper-line px-2 py-1 disabled:opacity-40"
        >
          Previous
        </button>
        <span>
          Page {query.page} of {pages}
        </span>
        <button
          type="button"
          disabled={!hydrated || query.page >= pages}
          onClick={() => change({ page: query.page + 1 })}
          className="rounded border border-paper-line px-2 py-1 disabled:opacity-40"
        >
          Next
        </button>
      </nav>
      <AddTemplateForm boards={boards} />
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
