import { describe, expect, it } from 'vitest';
import { DEFAULT_LIST_QUERY, listQueryFromSearch, searchFromListQuery } from '~/components/boards/board-url-state.ts';

describe('Boards list state in the URL', () => {
  it('leaves the default view out of the URL', () => {
    expect(searchFromListQuery(DEFAULT_LIST_QUERY)).toBe('');
    expect(listQueryFromSearch('')).toEqual(DEFAULT_LIST_QUERY);
  });

  it('round-trips search, filters, sort and page', () => {
    const query = { ...DEFAULT_LIST_QUERY, q: 'Ines', status: 'archived' as const, instrument: 'bass' as const, units: 'in' as const, sort: 'scale' as const, dir: 'desc' as const, page: 3, pageSize: 50 };
    const search = searchFromListQuery(query);
    expect(search).toBe('?q=Ines&status=archived&instrument=bass&units=in&sort=scale&dir=desc&page=3&pageSize=50');
    expect(listQueryFromSearch(search)).toEqual(query);
  });

  it('drops bad values from a hand-edited URL and keeps the good ones', () => {
    expect(listQueryFromSearch('?page=-2&pageSize=5000&sort=colour&q=mandolin&status=nope')).toEqual({ ...DEFAULT_LIST_QUERY, q: 'mandolin' });
  });
});
