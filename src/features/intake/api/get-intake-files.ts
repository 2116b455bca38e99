import { queryOptions, useQuery } from '@tanstack/react-query';
import { intakeFileListSchema } from '../../../../shared/contracts/intake';
import { apiClient } from '../../../lib/api-client';
import { intakeKeys } from './intake-keys';

export const getIntakeFiles = (signal?: AbortSignal) => apiClient.get('/api/intake-files', intakeFileListSchema, signal);

/** Polls quickly while a file is being taken in (progress), slowly otherwise (new arrivals). */
export const intakeFilesQueryOptions = () =>
  queryOptions({
    queryKey: intakeKeys.files(),
    queryFn: ({ signal }) => getIntakeFiles(signal),
    refetchInterval: (query) => ((query.state.data?.active ?? 0) > 0 ? 1_000 : 10_000),
  });

/** The latest files the intake received, newest first. */
export function useIntakeFiles() {
  return useQuery(intakeFilesQueryOptions());
}
