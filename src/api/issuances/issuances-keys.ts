import type { ArchiveQuery } from '../../../shared/contracts/workflow';

/**
 * The one query-key factory of the issuances resource, general to specific. A publication, a
 * withdrawal or an amendment invalidates `issuancesKeys.all`, so the bulletin, the archive,
 * every issuance page and the review screen's baseline refresh.
 */
export const issuancesKeys = {
  all: ['issuances'] as const,
  current: () => [...issuancesKeys.all, 'current'] as const,
  lists: () => [...issuancesKeys.all, 'list'] as const,
  list: (query: ArchiveQuery) => [...issuancesKeys.lists(), query] as const,
  details: () => [...issuancesKeys.all, 'detail'] as const,
  detail: (issuanceNumber: string) => [...issuancesKeys.details(), issuanceNumber] as const,
  verification: (issuanceNumber: string) => [...issuancesKeys.detail(issuanceNumber), 'verification'] as const,
};
