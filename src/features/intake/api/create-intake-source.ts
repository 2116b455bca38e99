import { useMutation, useQueryClient } from '@tanstack/react-query';
import { intakeSourceSchema, type CreateIntakeSourceInput } from '../../../../shared/contracts/intake';
import { apiClient } from '../../../lib/api-client';
import { intakeKeys } from './intake-keys';

export const createIntakeSource = (input: CreateIntakeSourceInput) => apiClient.post('/api/intake-sources', input, intakeSourceSchema);

/** Adds a scheduled pull source. */
export function useCreateIntakeSource() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: createIntakeSource, onSuccess: () => queryClient.invalidateQueries({ queryKey: intakeKeys.all }) });
}
