import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '../../../lib/api-client';
import { soundingsKeys } from './soundings-keys';

const deleteSoundingResponseSchema = z.object({ deleted: z.number() });

export const deleteSounding = (soundingId: string) =>
  apiRequest(`/api/soundings/${encodeURIComponent(soundingId)}`, { method: 'DELETE', schema: deleteSoundingResponseSchema });

/** Deletes a sounding (and its what-if soundings), then refreshes every soundings query. */
export function useDeleteSounding() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteSounding,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: soundingsKeys.all }),
  });
}
