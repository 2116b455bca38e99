import { describe, expect, it } from 'vitest';
import { filtersFromSearchParams, searchParamsFromFilters, withFilterChange } from './library-filters';

describe('library filters in the address bar', () => {
  it('when the address has no parameters, gives the defaults (newest first, 50 a page)', () => {
    const filters = filtersFromSearchParams(new URLSearchParams());
    expect(filters).toMatchObject({ page: 1, pageSize: 50, sort: 'validTime', order: 'desc', modified: 'include' });
    expect(searchParamsFromFilters(filters).toString()).toBe('');
  });

  it('when a parameter is unreadable, drops only that one', () => {
    const filters = filtersFromSearchParams(new URLSearchParams('sort=colour&station=MV12&page=0'));
    expect(filters.sort).toBe('validTime');
    expect(filters.page).toBe(1);
    expect(filters.station).toBe('MV12');
  });

  it('when a filter changes, goes back to page 1 and round-trips through the address', () => {
    const filters = withFilterChange(filtersFromSearchParams(new URLSearchParams('page=4')), { source: 'model', modified: 'only' });
    expect(filters.page).toBe(1);
    const params = searchParamsFromFilters(filters);
    expect(params.toString()).toBe('source=model&modified=only');
    expect(filtersFromSearchParams(params)).toEqual(filters);
  });
});
