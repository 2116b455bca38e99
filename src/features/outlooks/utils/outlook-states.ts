import type { OutlookState } from '../../../../shared/contracts/outlooks';

export const outlookStateLabels: Record<OutlookState, string> = {
  draft: 'Draft',
  in_review: 'In review',
  returned: 'Returned',
  approved: 'Approved',
  published: 'Published',
};

/** Only drafts and returned drafts are edited in the workspace; the rest open read-only. */
export function isEditableState(state: OutlookState): boolean {
  return state === 'draft' || state === 'returned';
}

/** Who may write: forecasters and leads (admins read). */
export function canAuthor(role: string | undefined): boolean {
  return role === 'forecaster' || role === 'lead';
}
