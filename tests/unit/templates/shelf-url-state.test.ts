import { describe, expect, it } from 'vitest';
import { listQueryFromSearch, searchFromListQuery } from '~/components/ui/list-url-state.ts';
import { templateListQuerySchema, type TemplateListQuery } from '~/lib/schemas/template.ts';

const DEFAULTS: TemplateListQuery = templateListQuerySchema.parse({});
const fromSearch = (search: string) => listQueryFromSearch(templateListQuerySchema, search);
const toSearch = (query: TemplateListQuery) => searchFromListQuery(templateListQuerySchema, query);

describe('Template shelf list state in the URL', () => {
  it('leaves the default view out of the URL', () => {
    expect(toSearch(DEFAULTS)).toBe('');
    expect(fromSearch('')).toEqual(DEFAULTS);
  });

  it('round-trips search, condition and last-check filters, sort and page', () => {
    const query: TemplateListQuery = { ...DEFAULTS, q: '628.65', condition: 'worn', lastResult: 'fail', sort: 'lastChecked', dir: 'asc', page: 2, pageSize: 10 };
    const search = toSearch(query);
    expect(search).toBe('?q=628.65&condition=worn&lastResult=fail&sort=lastChecked&dir=asc&page=2&pageSize=10');
    expect(fromSearch(search)).toEqual(query);
  });

  it('drops bad values from a hand-edited URL and keeps the good ones', () => {
    expect(fromSearch('?lastResult=maybe&condition=lost&sort=colour&page=0&pageSize=500&q=drawer')).toEqual({ ...DEFAULTS, q: 'drawer' });
    expect(fromSearch('?lastResult=never&unknown=1')).toEqual({ ...DEFAULTS, lastResult: 'never' });
  });
});
