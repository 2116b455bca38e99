import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { soundingSummarySchema, type UpdateSoundingMetadataInput } from '../../../../shared/contracts/soundings';
import { soundingsKeys } from './soundings-keys';

export const updateSoundingMetadata = ({ soundingId, input }: { soundingId: string; input: UpdateSoundingMetadataInput }) =>
  apiClient.patch(`/api/soundings/${encodeURIComponent(soundingId)}/metadata`, input, soundingSummarySchema);

/** Fills in a sounding's station, position, valid time and source; lists, map and evidence refresh. */
export function useUpdateSoundingMetadata() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateSoundingMetadata,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: soundingsKeys.all }),
  });
}
