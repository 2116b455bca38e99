import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { userSummarySchema } from '../../../../shared/contracts/users';
import { adminKeys } from './admin-keys';

const usersResponseSchema = z.object({ users: z.array(userSummarySchema) });

export const getUsers = (signal?: AbortSignal) => apiClient.get('/api/users', usersResponseSchema, signal);

export const usersQueryOptions = () =>
  queryOptions({
    queryKey: adminKeys.userList(),
    queryFn: ({ signal }) => getUsers(signal),
  });

export function useUsers() {
  return useQuery(usersQueryOptions());
}
