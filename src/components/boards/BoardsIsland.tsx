import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { useCallback, useEffect, useState } from 'react';
import type { BoardListQuery } from '~/lib/schemas/board.ts';
import { BoardFilters } from './BoardFilters.tsx';
import { BoardsTable } from './BoardsTable.tsx';
import { ImportBoardButton } from './ImportBoardButton.tsx';
import { listQueryFromSearch, searchFromListQuery } from './board-url-state.ts';

interface Props {
  /** The page URL's search string when it was served, so the first render matches the URL. */
  initialSearch: string;
}

/** The Boards page: filters and table kept in the URL (Back and Forward restore a view). */
export default function BoardsIsland({ initialSearch }: Props) {
  const [client] = useState(() => new QueryClient({ defaultOptions: { queries: { staleTime: 10_000, retry: 1 } } }));
  const [query, setQuery] = useState(() => listQueryFromSearch(initialSearch));

  useEffect(() => {
    const onPop = () => setQuery(listQueryFromSearch(window.location.search));
    window.addEventListener('popstate', onPop);
    return () => window.removeEventListener('popstate', onPop);
  }, []);

  const change = useCallback((partial: Partial<BoardListQuery>) => {
    setQuery((current) => {
      const next = { ...current, ...partial };
      const search = searchFromListQuery(next);
      if (search !== window.location.search) window.history.pushState(null, '', `${window.location.pathname}${search}`);
      return next;
    });
  }, []);

  return (
    <QueryClientProvider client={client}>
      <div className="space-y-4">
        <div className="flex flex-wrap items-end justify-between gap-4">
          <BoardFilters query={query} onChange={change} />
          <ImportBoardButton />
        </div>
        <BoardsTable query={query} onChange={change} />
      </div>
    </QueryClientProvider>
  );
}
