import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../lib/api-client';
import { modelFieldSchema } from '../../../shared/contracts/model-fields';
import { modelFieldsKeys } from './model-fields-keys';

export const getModelField = (runId: string, figure: string, signal?: AbortSignal) =>
  apiClient.get(`/api/model-runs/${encodeURIComponent(runId)}/field?figure=${encodeURIComponent(figure)}`, modelFieldSchema, signal);

export const modelFieldQuery = (runId: string, figure: string) =>
  queryOptions({ queryKey: modelFieldsKeys.field(runId, figure), queryFn: ({ signal }) => getModelField(runId, figure, signal), staleTime: Infinity });

/** Filled contour bands of one key figure of a run (a ready run never changes, so the answer stays fresh). */
export function useModelField(runId: string | null, figure: string) {
  return useQuery({ ...modelFieldQuery(runId ?? '', figure), enabled: runId !== null, placeholderData: keepPreviousData });
}
