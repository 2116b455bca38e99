import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { soundingSummarySchema, type SaveModifiedSoundingInput } from '../../../../shared/contracts/soundings';
import { soundingsKeys } from './soundings-keys';

export const saveModifiedSounding = ({ soundingId, input }: { soundingId: string; input: SaveModifiedSoundingInput }) =>
  apiClient.post(`/api/soundings/${encodeURIComponent(soundingId)}/modified`, input, soundingSummarySchema);

/** Saves a what-if sounding from the editor; lists and the map refresh to show it. */
export function useSaveModifiedSounding() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: saveModifiedSounding,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: soundingsKeys.all }),
  });
}
