import { useMutation, useQueryClient } from '@tanstack/react-query';
import { pullResultSchema } from '../../../../shared/contracts/intake';
import { apiClient } from '../../../lib/api-client';
import { intakeKeys } from './intake-keys';

export const pullIntakeSource = (sourceId: string) => apiClient.post(`/api/intake-sources/${encodeURIComponent(sourceId)}/pull`, {}, pullResultSchema);

/** Pulls a source now; the files it fetched appear in the list. */
export function usePullIntakeSource() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: pullIntakeSource, onSuccess: () => queryClient.invalidateQueries({ queryKey: intakeKeys.all }) });
}
