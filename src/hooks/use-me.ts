import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest, isApiError } from '../lib/api-client';
import { meSchema, type Me } from '../../shared/contracts/me';

/** Keys for the signed-in person: `['me']` is the prefix every write to the session invalidates. */
export const meKeys = {
  all: ['me'] as const,
  detail: () => [...meKeys.all, 'detail'] as const,
};

/** `null` means nobody is signed in (the server answered 401). */
export async function getMe(signal?: AbortSignal): Promise<Me | null> {
  try {
    return await apiRequest('/api/me', { schema: meSchema, signal });
  } catch (error) {
    if (isApiError(error) && error.status === 401) return null;
    throw error;
  }
}

export const meQueryOptions = () =>
  queryOptions({
    queryKey: meKeys.detail(),
    queryFn: ({ signal }) => getMe(signal),
    staleTime: 60_000,
  });

export function useMe() {
  return useQuery(meQueryOptions());
}
