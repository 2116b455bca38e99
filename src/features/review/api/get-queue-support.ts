import { useQueries } from '@tanstack/react-query';
import { outlookEvidenceQuery } from '../../../api/outlooks/get-outlook-evidence';

/** The support check of each queued outlook (one evidence request each; the queue is short). */
export function useQueueSupport(outlookIds: readonly string[]) {
  return useQueries({ queries: outlookIds.map((id) => outlookEvidenceQuery(id)) });
}
