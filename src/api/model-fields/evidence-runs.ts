import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../lib/api-client';
import { evidenceRunSelectionSchema, type UpdateEvidenceRunsInput } from '../../../shared/contracts/model-fields';
import { outlooksKeys } from '../outlooks/outlooks-keys';
import { modelFieldsKeys } from './model-fields-keys';

export const getEvidenceRuns = (outlookId: string, signal?: AbortSignal) => apiClient.get(`/api/outlooks/${encodeURIComponent(outlookId)}/evidence-runs`, evidenceRunSelectionSchema, signal);

export const evidenceRunsQuery = (outlookId: string) => queryOptions({ queryKey: modelFieldsKeys.evidenceRuns(outlookId), queryFn: ({ signal }) => getEvidenceRuns(outlookId, signal) });

/** Which model runs feed the outlook's evidence, and which may be picked. */
export function useEvidenceRuns(outlookId: string) {
  return useQuery(evidenceRunsQuery(outlookId));
}

/** Stores the author's pick; the evidence of the outlook is refreshed after. */
export function useUpdateEvidenceRuns(outlookId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: UpdateEvidenceRunsInput) => apiClient.patch(`/api/outlooks/${encodeURIComponent(outlookId)}/evidence-runs`, input, evidenceRunSelectionSchema),
    onSuccess: (selection) => {
      queryClient.setQueryData(evidenceRunsQuery(outlookId).queryKey, selection);
      // The report and the live preview's candidates both follow the runs picked.
      return Promise.all([
        queryClient.invalidateQueries({ queryKey: [...outlooksKeys.all, 'evidence', outlookId] }),
        queryClient.invalidateQueries({ queryKey: [...outlooksKeys.all, 'evidence-candidates', outlookId] }),
      ]);
    },
    onError: () => queryClient.invalidateQueries({ queryKey: evidenceRunsQuery(outlookId).queryKey }),
  });
}
