import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../lib/api-client';
import { fieldRunListSchema } from '../../../shared/contracts/model-fields';
import { modelFieldsKeys } from './model-fields-keys';

export const getFieldRuns = (signal?: AbortSignal) => apiClient.get('/api/model-fields', fieldRunListSchema, signal);

export const fieldRunsQuery = () => queryOptions({ queryKey: modelFieldsKeys.runs(), queryFn: ({ signal }) => getFieldRuns(signal) });

/** The ready model runs whose fields can be drawn, newest valid time first. */
export function useFieldRuns(enabled = true) {
  return useQuery({ ...fieldRunsQuery(), enabled });
}
