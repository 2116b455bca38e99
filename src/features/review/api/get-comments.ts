import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { reviewKeys } from './review-keys';

export const reviewCommentSchema = z.object({
  id: z.string(),
  body: z.string(),
  riskAreaId: z.string().nullable(),
  revisionNumber: z.number().nullable(),
  authorName: z.string().nullable(),
  createdAt: z.string(),
});
export type ReviewComment = z.infer<typeof reviewCommentSchema>;

const commentsSchema = z.object({ comments: z.array(reviewCommentSchema) });

export const getComments = (outlookId: string, signal?: AbortSignal) =>
  apiClient.get(`/api/outlooks/${encodeURIComponent(outlookId)}/comments`, commentsSchema, signal);

export const commentsQuery = (outlookId: string) =>
  queryOptions({
    queryKey: reviewKeys.comments(outlookId),
    queryFn: ({ signal }) => getComments(outlookId, signal),
  });

/** The review thread, oldest first: general comments and comments pinned to an area. */
export function useComments(outlookId: string) {
  return useQuery(commentsQuery(outlookId));
}
