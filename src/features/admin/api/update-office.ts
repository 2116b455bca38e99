import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { officeKeys, officeQueryOptions } from '../../../hooks/use-office';
import { officeSettingsSchema, type OfficeSettingsInput } from '../../../../shared/contracts/office';

/** Saves office settings with the version the editor loaded; a stale version answers 409 CONFLICT. */
export const updateOffice = (input: OfficeSettingsInput) => apiClient.put('/api/office', input, officeSettingsSchema);

export function useUpdateOffice() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateOffice,
    onSuccess: (office) => {
      queryClient.setQueryData(officeQueryOptions().queryKey, office);
      return queryClient.invalidateQueries({ queryKey: officeKeys.all });
    },
  });
}
