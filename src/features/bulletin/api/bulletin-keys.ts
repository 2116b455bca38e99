import type { ArchiveQuery } from '../../../../shared/contracts/workflow';

/**
 * Query keys of the public issuances, general to specific. A withdrawal or an amendment
 * invalidates `bulletinKeys.all`, so the bulletin, the archive and every issuance page refresh.
 */
export const bulletinKeys = {
  all: ['issuances'] as const,
  current: () => [...bulletinKeys.all, 'current'] as const,
  lists: () => [...bulletinKeys.all, 'list'] as const,
  list: (query: ArchiveQuery) => [...bulletinKeys.lists(), query] as const,
  details: () => [...bulletinKeys.all, 'detail'] as const,
  detail: (issuanceNumber: string) => [...bulletinKeys.details(), issuanceNumber] as const,
  verification: (issuanceNumber: string) => [...bulletinKeys.detail(issuanceNumber), 'verification'] as const,
};
