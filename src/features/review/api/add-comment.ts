import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import type { CommentInput } from '../../../../shared/contracts/workflow';
import { commentsQuery, reviewCommentSchema } from './get-comments';
import { reviewKeys } from './review-keys';

export const addComment = (outlookId: string, input: CommentInput) =>
  apiClient.post(`/api/outlooks/${encodeURIComponent(outlookId)}/comments`, input, reviewCommentSchema);

export function useAddComment(outlookId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CommentInput) => addComment(outlookId, input),
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: commentsQuery(outlookId).queryKey });
      await queryClient.invalidateQueries({ queryKey: reviewKeys.audit(outlookId) });
    },
  });
}
