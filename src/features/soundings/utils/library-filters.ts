import { soundingListQuerySchema, type SoundingListQuery } from '../../../../shared/contracts/soundings';

/**
 * The library keeps its page, sort and filters in the address bar, so a link or a reload shows the
 * same rows. Unreadable parameters are dropped (the default applies) rather than breaking the page.
 */
export function filtersFromSearchParams(params: URLSearchParams): SoundingListQuery {
  const raw: Record<string, string> = {};
  for (const [key, value] of params) if (value !== '') raw[key] = value;
  for (let attempt = 0; attempt < 12; attempt += 1) {
    const parsed = soundingListQuerySchema.safeParse(raw);
    if (parsed.success) return parsed.data;
    for (const issue of parsed.error.issues) {
      const key = issue.path[0];
      if (typeof key === 'string') delete raw[key];
    }
  }
  return soundingListQuerySchema.parse({});
}

const defaults = soundingListQuerySchema.parse({});

/** The address-bar form of the filters; defaults are left out to keep links short. */
export function searchParamsFromFilters(filters: SoundingListQuery): URLSearchParams {
  const params = new URLSearchParams();
  const entries: [keyof SoundingListQuery, SoundingListQuery[keyof SoundingListQuery]][] = [
    ['page', filters.page],
    ['pageSize', filters.pageSize],
    ['sort', filters.sort],
    ['order', filters.order],
    ['source', filters.source],
    ['station', filters.station],
    ['validFrom', filters.validFrom],
    ['validTo', filters.validTo],
    ['modified', filters.modified],
  ];
  for (const [key, value] of entries) {
    if (value === undefined || value === '' || value === defaults[key]) continue;
    params.set(key, String(value));
  }
  return params;
}

/** A filter change starts again at page 1 (the old page may no longer exist). */
export function withFilterChange(filters: SoundingListQuery, change: Partial<SoundingListQuery>): SoundingListQuery {
  return { ...filters, ...change, page: change.page ?? 1 };
}

export function pageCount(total: number, pageSize: number): number {
  return Math.max(1, Math.ceil(total / pageSize));
}
