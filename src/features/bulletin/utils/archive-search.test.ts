import { describe, expect, it } from 'vitest';
import { archiveQueryFrom, archiveSearchFor, pageCount } from './archive-search';

describe('archive search in the address', () => {
  it('reads text, date and page', () => {
    expect(archiveQueryFrom(new URLSearchParams('q=hail&date=2027-04-18&page=2'))).toEqual({ q: 'hail', date: '2027-04-18', page: 2, pageSize: 20 });
  });

  it('when the date is malformed, keeps the text and drops the rest', () => {
    expect(archiveQueryFrom(new URLSearchParams('q=hail&date=18/04/2027'))).toEqual({ q: 'hail', page: 1, pageSize: 20 });
  });

  it('leaves defaults out of links', () => {
    expect(archiveSearchFor({ q: '', date: undefined, page: 1 }).toString()).toBe('');
    expect(archiveSearchFor({ q: 'wind', date: '2027-04-18', page: 3 }).toString()).toBe('q=wind&date=2027-04-18&page=3');
  });

  it('counts at least one page', () => {
    expect(pageCount(0, 20)).toBe(1);
    expect(pageCount(41, 20)).toBe(3);
  });
});
