import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../lib/api-client';
import { reviewCommentSchema, type CommentInput } from '../../../shared/contracts/workflow';
import { outlooksKeys } from './outlooks-keys';

export const addComment = (outlookId: string, input: CommentInput) => apiClient.post(`/api/outlooks/${encodeURIComponent(outlookId)}/comments`, input, reviewCommentSchema);

export function useAddComment(outlookId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CommentInput) => addComment(outlookId, input),
    onSuccess: async () => {
      await Promise.all([queryClient.invalidateQueries({ queryKey: outlooksKeys.comments(outlookId) }), queryClient.invalidateQueries({ queryKey: outlooksKeys.audit(outlookId) })]);
    },
  });
}
