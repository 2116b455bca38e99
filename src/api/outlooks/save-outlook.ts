import { apiClient } from '../../lib/api-client';
import { outlookSchema, type SaveOutlookInput } from '../../../shared/contracts/outlooks';

/**
 * Saves the whole draft with the version it was loaded at. A stale version answers 409
 * `CONFLICT`; the autosave hook turns that into the reload / keep-mine prompt.
 */
export const saveOutlook = (outlookId: string, input: SaveOutlookInput) => apiClient.put(`/api/outlooks/${encodeURIComponent(outlookId)}`, input, outlookSchema);
