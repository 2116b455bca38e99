import { useMutation } from '@tanstack/react-query';
import { apiClient } from '../../lib/api-client';
import { areaImportResultSchema } from '../../../shared/contracts/outlooks';

export const importAreas = (geojson: unknown) => apiClient.post('/api/outlooks/area-imports', { geojson }, areaImportResultSchema);

/** Reads risk areas from a GeoJSON document; nothing is saved until the draft autosaves. */
export function useImportAreas() {
  return useMutation({ mutationFn: importAreas });
}
