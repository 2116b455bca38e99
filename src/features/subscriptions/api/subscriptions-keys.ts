/**
 * Query keys of the subscriptions feature, general to specific: feature, resource, kind, params.
 * Writes to the signed-in subscriber's settings or areas invalidate `mine()`.
 */
export const subscriptionsKeys = {
  all: ['subscriptions'] as const,
  mine: () => [...subscriptionsKeys.all, 'mine'] as const,
  list: () => [...subscriptionsKeys.all, 'list'] as const,
  places: (query: string, kind: 'county' | 'state' | undefined) => [...subscriptionsKeys.all, 'places', { query, kind: kind ?? 'any' }] as const,
};
