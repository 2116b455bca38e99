import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import type { ArchiveQuery } from '../../../../shared/contracts/workflow';
import { issuancesKeys } from '../../../api/issuances/issuances-keys';
import { archiveEntrySchema } from './issuance-schema';

const archiveSchema = z.object({ issuances: z.array(archiveEntrySchema), total: z.number(), caution: z.string() });

export const getArchive = (query: ArchiveQuery, signal?: AbortSignal) => {
  const search = new URLSearchParams({ page: String(query.page), pageSize: String(query.pageSize) });
  if (query.q) search.set('q', query.q);
  if (query.date) search.set('date', query.date);
  return apiClient.get(`/api/public/issuances?${search.toString()}`, archiveSchema, signal);
};

export const archiveQuery = (query: ArchiveQuery) =>
  queryOptions({
    queryKey: issuancesKeys.list(query),
    queryFn: ({ signal }) => getArchive(query, signal),
  });

/** Every issuance, newest first, superseded and withdrawn ones included. */
export function useArchive(query: ArchiveQuery) {
  return useQuery({ ...archiveQuery(query), placeholderData: keepPreviousData });
}
