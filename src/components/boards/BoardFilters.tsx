import { useEffect, useState } from 'react';
import { useHydrated } from '~/components/ui/use-hydrated.ts';
import { BOARD_SORTS, BOARD_STATUS_FILTERS, INSTRUMENT_TYPES, type BoardListQuery } from '~/lib/schemas/board.ts';
import { INSTRUMENT_LABELS, SORT_LABELS, STATUS_LABELS } from './board-labels.ts';

interface Props {
  query: BoardListQuery;
  onChange: (change: Partial<BoardListQuery>) => void;
}

const SEARCH_DELAY_MS = 300;
const control = 'rounded border border-paper-line bg-white px-2 py-1 text-sm';

/** Search box and filter selects above the Boards table; every change goes back to page 1. */
export function BoardFilters({ query, onChange }: Props) {
  const hydrated = useHydrated();
  const [search, setSearch] = useState(query.q);
  useEffect(() => setSearch(query.q), [query.q]);
  useEffect(() => {
    if (search === query.q) return;
    const timer = setTimeout(() => onChange({ q: search, page: 1 }), SEARCH_DELAY_MS);
    return () => clearTimeout(timer);
  }, [search, query.q, onChange]);

  return (
    <form role="search" onSubmit={(e) => { e.preventDefault(); onChange({ q: search, page: 1 }); }}>
      {/* Disabled until hydrated, so nothing typed before React listens is lost. */}
      <fieldset className="flex flex-wrap items-end gap-3" disabled={!hydrated}>
      <label className="flex flex-col text-sm">
        Search name or client
        <input type="search" className={`${control} w-64`} value={search} onChange={(e) => setSearch(e.target.value)} />
      </label>
      <label className="flex flex-col text-sm">
        Status
        <select className={control} value={query.status} onChange={(e) => onChange({ status: e.target.value as BoardListQuery['status'], page: 1 })}>
          {BOARD_STATUS_FILTERS.map((s) => <option key={s} value={s}>{STATUS_LABELS[s]}</option>)}
        </select>
      </label>
      <label className="flex flex-col text-sm">
        Instrument
        <select className={control} value={query.instrument ?? ''} onChange={(e) => onChange({ instrument: (e.target.value || undefined) as BoardListQuery['instrument'], page: 1 })}>
          <option value="">Any</option>
          {INSTRUMENT_TYPES.map((t) => <option key={t} value={t}>{INSTRUMENT_LABELS[t]}</option>)}
        </select>
      </label>
      <label className="flex flex-col text-sm">
        Units
        <select className={control} value={query.units ?? ''} onChange={(e) => onChange({ units: (e.target.value || undefined) as BoardListQuery['units'], page: 1 })}>
          <option value="">Any</option>
          <option value="mm">mm</option>
          <option value="in">in</option>
        </select>
      </label>
      <label className="flex flex-col text-sm">
        Sort by
        <select className={control} value={query.sort} onChange={(e) => onChange({ sort: e.target.value as BoardListQuery['sort'], dir: undefined, page: 1 })}>
          {BOARD_SORTS.map((s) => <option key={s} value={s}>{SORT_LABELS[s]}</option>)}
        </select>
      </label>
      </fieldset>
    </form>
  );
}
