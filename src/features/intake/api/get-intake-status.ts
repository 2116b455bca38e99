import { queryOptions, useQuery } from '@tanstack/react-query';
import { intakeStatusSchema } from '../../../../shared/contracts/intake';
import { apiClient } from '../../../lib/api-client';
import { intakeKeys } from './intake-keys';

export const getIntakeStatus = (signal?: AbortSignal) => apiClient.get('/api/intake/status', intakeStatusSchema, signal);

export const intakeStatusQueryOptions = () => queryOptions({ queryKey: intakeKeys.status(), queryFn: ({ signal }) => getIntakeStatus(signal), staleTime: 60_000 });

/** Whether ecCodes is installed and the intake folder watched. */
export function useIntakeStatus() {
  return useQuery(intakeStatusQueryOptions());
}
