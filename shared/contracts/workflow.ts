import { z } from 'zod';
import { calendarDateSchema, versionSchema } from './primitives';
import { outlookStates } from './outlooks';

export const workflowActions = ['submit', 'return', 'approve', 'publish'] as const;
export type WorkflowAction = (typeof workflowActions)[number];

export const transitionInputSchema = z.object({
  /** The version the person acted on; a stale one gets 409 so nobody approves what they did not see. */
  version: versionSchema,
  comment: z.string().trim().max(4000, { message: 'Keep the comment under 4,000 characters.' }).optional(),
});
export type TransitionInput = z.infer<typeof transitionInputSchema>;

export const commentInputSchema = z.object({
  body: z.string().trim().min(1, { message: 'Write a comment first.' }).max(4000, { message: 'Keep the comment under 4,000 characters.' }),
  riskAreaId: z.string().uuid({ message: 'Pin the comment to an area of this outlook, or leave it general.' }).optional(),
});
export type CommentInput = z.infer<typeof commentInputSchema>;

export const withdrawInputSchema = z.object({
  reason: z.string().trim().min(5, { message: 'Give the public a reason for the withdrawal (at least 5 characters).' }).max(1000),
});

export { issuanceStates, type IssuanceState } from './issuances';

/** What a workflow action answers. */
export const transitionResultSchema = z.object({ outlookId: z.string(), state: z.enum(outlookStates), version: z.number(), issuanceNumber: z.string().optional() });
export type TransitionResult = z.infer<typeof transitionResultSchema>;

export const reviewCommentSchema = z.object({
  id: z.string(),
  body: z.string(),
  riskAreaId: z.string().nullable(),
  revisionNumber: z.number().nullable(),
  authorName: z.string().nullable(),
  createdAt: z.string(),
});
export type ReviewComment = z.infer<typeof reviewCommentSchema>;

export const commentListSchema = z.object({ comments: z.array(reviewCommentSchema) });
export type CommentList = z.infer<typeof commentListSchema>;

export const auditEventSchema = z.object({
  id: z.string(),
  action: z.string(),
  fromState: z.string().nullable(),
  toState: z.string().nullable(),
  comment: z.string().nullable(),
  details: z.record(z.string(), z.unknown()),
  actorName: z.string().nullable(),
  createdAt: z.string(),
});
export type AuditEvent = z.infer<typeof auditEventSchema>;

export const auditTrailSchema = z.object({ events: z.array(auditEventSchema) });
export type AuditTrail = z.infer<typeof auditTrailSchema>;

export const archiveQuerySchema = z.object({
  q: z.string().trim().max(100).optional(),
  date: calendarDateSchema('Date').optional(),
  page: z.coerce.number().int().min(1, { message: 'Page starts at 1.' }).max(100_000, { message: 'Page must be at most 100,000.' }).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(20),
});
export type ArchiveQuery = z.infer<typeof archiveQuerySchema>;

export const issuanceNumberSchema = z.string().regex(/^\d{4}-\d{4}$/, { message: 'An issuance number looks like 2027-0142.' });
