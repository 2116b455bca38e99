import type { OutlookState } from '../contracts/outlooks';
import type { IssuanceState } from '../contracts/workflow';

/** Outlook (draft) states in words, for status strips, lists and the review screen. */
export const outlookStateLabels: Record<OutlookState, string> = {
  draft: 'Draft',
  in_review: 'In review',
  returned: 'Returned',
  approved: 'Approved',
  published: 'Published',
};

/** Issuance states in words (an issuance is published, then maybe superseded or withdrawn). */
export const issuanceStateLabels: Record<IssuanceState, string> = {
  published: 'Published',
  superseded: 'Superseded',
  withdrawn: 'Withdrawn',
};

/** An outlook state inside a sentence ("This outlook is in review"). */
export const outlookStatePhrases: Record<OutlookState, string> = {
  draft: 'a draft',
  in_review: 'in review',
  returned: 'returned',
  approved: 'approved',
  published: 'published',
};
