import type { SoundingListQuery } from '../../../../shared/contracts/soundings';

/**
 * Query keys of the soundings feature, general to specific: resource, kind, params.
 * Every write invalidates `soundingsKeys.all`, so lists, details and the map refresh together.
 */
export const soundingsKeys = {
  all: ['soundings'] as const,
  lists: () => [...soundingsKeys.all, 'list'] as const,
  list: (filters: SoundingListQuery) => [...soundingsKeys.lists(), filters] as const,
  details: () => [...soundingsKeys.all, 'detail'] as const,
  detail: (soundingId: string) => [...soundingsKeys.details(), soundingId] as const,
};
