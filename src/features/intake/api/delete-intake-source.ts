import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '../../../lib/api-client';
import { intakeKeys } from './intake-keys';

export const deleteIntakeSource = (sourceId: string) => apiRequest(`/api/intake-sources/${encodeURIComponent(sourceId)}`, { method: 'DELETE', schema: z.object({ deleted: z.literal(true) }) });

/** Removes a pull source (the files it brought stay listed). */
export function useDeleteIntakeSource() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: deleteIntakeSource, onSuccess: () => queryClient.invalidateQueries({ queryKey: intakeKeys.all }) });
}
