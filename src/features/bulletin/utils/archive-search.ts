import { archiveQuerySchema, type ArchiveQuery } from '../../../../shared/contracts/workflow';

export const ARCHIVE_PAGE_SIZE = 20;

/** Reads the archive filters from the address (?q, ?date, ?page); anything invalid is dropped. */
export function archiveQueryFrom(search: URLSearchParams): ArchiveQuery {
  const raw = {
    q: search.get('q') || undefined,
    date: search.get('date') || undefined,
    page: search.get('page') ?? 1,
    pageSize: ARCHIVE_PAGE_SIZE,
  };
  const parsed = archiveQuerySchema.safeParse(raw);
  if (parsed.success) return parsed.data;
  const fallback = archiveQuerySchema.safeParse({ q: raw.q, pageSize: ARCHIVE_PAGE_SIZE });
  return fallback.success ? fallback.data : { page: 1, pageSize: ARCHIVE_PAGE_SIZE };
}

/** The address parameters for a query (defaults left out, so links stay short). */
export function archiveSearchFor(query: Pick<ArchiveQuery, 'q' | 'date' | 'page'>): URLSearchParams {
  const search = new URLSearchParams();
  if (query.q) search.set('q', query.q);
  if (query.date) search.set('date', query.date);
  if (query.page > 1) search.set('page', String(query.page));
  return search;
}

export function pageCount(total: number, pageSize: number): number {
  return Math.max(1, Math.ceil(total / pageSize));
}
