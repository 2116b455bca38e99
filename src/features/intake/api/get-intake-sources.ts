import { queryOptions, useQuery } from '@tanstack/react-query';
import { intakeSourceListSchema } from '../../../../shared/contracts/intake';
import { apiClient } from '../../../lib/api-client';
import { intakeKeys } from './intake-keys';

export const getIntakeSources = (signal?: AbortSignal) => apiClient.get('/api/intake-sources', intakeSourceListSchema, signal);

export const intakeSourcesQueryOptions = () => queryOptions({ queryKey: intakeKeys.sources(), queryFn: ({ signal }) => getIntakeSources(signal) });

/** The scheduled pull sources (admins). */
export function useIntakeSources(enabled: boolean) {
  return useQuery({ ...intakeSourcesQueryOptions(), enabled });
}
