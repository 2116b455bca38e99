import { useMutation } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { riskAreaInputSchema } from '../../../../shared/contracts/outlooks';

const importResultSchema = z.object({ areas: z.array(riskAreaInputSchema) });

export const importAreas = (geojson: unknown) => apiClient.post('/api/outlooks/area-imports', { geojson }, importResultSchema);

/** Reads risk areas from a GeoJSON document; nothing is saved until the draft autosaves. */
export function useImportAreas() {
  return useMutation({ mutationFn: importAreas });
}
