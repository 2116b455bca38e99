import { keepPreviousData, queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient, apiRequest } from '../../../lib/api-client';
import { gridSoundingDetailSchema, gridSoundingPageSchema, modelRunSummarySchema } from '../../../../shared/contracts/model-runs';

/** Query keys of model runs, general to specific. */
export const modelRunsKeys = {
  all: ['model-runs'] as const,
  list: () => [...modelRunsKeys.all, 'list'] as const,
  soundings: (runId: string, offset: number) => [...modelRunsKeys.all, 'soundings', runId, offset] as const,
  gridSounding: (id: string) => [...modelRunsKeys.all, 'grid-sounding', id] as const,
};

export const modelRunsQuery = () =>
  queryOptions({
    queryKey: modelRunsKeys.list(),
    queryFn: ({ signal }) => apiClient.get('/api/model-runs', z.array(modelRunSummarySchema), signal),
  });

/** The office's model runs with their counts (the library's run list and run filter). */
export function useModelRuns() {
  return useQuery(modelRunsQuery());
}

/** Rows per page of a run's grid soundings. */
export const GRID_PAGE_SIZE = 50;

/** One page of a run's grid soundings. */
export function useRunSoundings(runId: string | undefined, offset: number) {
  return useQuery({
    queryKey: modelRunsKeys.soundings(runId ?? '', offset),
    queryFn: ({ signal }) => apiClient.get(`/api/model-runs/${encodeURIComponent(runId ?? '')}/soundings?offset=${offset}&limit=${GRID_PAGE_SIZE}`, gridSoundingPageSchema, signal),
    enabled: runId !== undefined,
    placeholderData: keepPreviousData,
  });
}

export const gridSoundingQuery = (id: string) =>
  queryOptions({
    queryKey: modelRunsKeys.gridSounding(id),
    queryFn: ({ signal }) => apiClient.get(`/api/grid-soundings/${encodeURIComponent(id)}`, gridSoundingDetailSchema, signal),
  });

/** Deletes a run and its grid soundings (lead forecasters and administrators), then refreshes the runs. */
export function useDeleteModelRun() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (runId: string) => apiRequest(`/api/model-runs/${encodeURIComponent(runId)}`, { method: 'DELETE', schema: z.object({ id: z.string() }) }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: modelRunsKeys.all }),
  });
}
