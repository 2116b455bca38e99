import type { Role } from '../contracts/common';
import type { OutlookState } from '../contracts/outlooks';
import type { WorkflowAction } from '../contracts/workflow';
import { authoringRoles, reviewingRoles } from './roles';
import { outlookStatePhrases } from './states';

export interface TransitionRule {
  /** States the action leaves from. */
  from: readonly OutlookState[];
  /** The state it reaches. */
  to: OutlookState;
  /** Roles allowed to take it. */
  roles: readonly Role[];
  /** A comment must say why (returning). */
  commentRequired: boolean;
}

/**
 * The one table of workflow transitions: Draft → In review → Returned / Approved → Published.
 * The server enforces it (workflow service and route access) and the client draws its action
 * buttons from it, through `checkTransition` below.
 */
export const transitions: Record<WorkflowAction, TransitionRule> = {
  submit: { from: ['draft', 'returned'], to: 'in_review', roles: authoringRoles, commentRequired: false },
  approve: { from: ['in_review'], to: 'approved', roles: reviewingRoles, commentRequired: false },
  return: { from: ['in_review', 'approved'], to: 'returned', roles: reviewingRoles, commentRequired: true },
  publish: { from: ['approved'], to: 'published', roles: reviewingRoles, commentRequired: false },
};

/** The order the actions are offered in. */
export const workflowActionOrder: readonly WorkflowAction[] = ['submit', 'approve', 'return', 'publish'];

/** States in which the draft's content may be saved. An approved draft is returned first. */
export const editableStates: readonly OutlookState[] = ['draft', 'returned'];

export function isEditableState(state: OutlookState): boolean {
  return editableStates.includes(state);
}

/** Who is asking, about which outlook: everything the workflow rules need to decide. */
export interface TransitionSubject {
  state: OutlookState;
  role: Role;
  userId: string;
  /**
   * Everyone who edited the content of the version under review: the authors of every revision
   * written since the last approval or return (or since the draft was created).
   */
  reviewEditorIds: readonly string[];
  /** The office relaxed the four-eyes rule (one-person shift); each use is audited. */
  allowSelfApproval: boolean;
}

export type TransitionVerdict =
  | { allowed: true; fourEyesRelaxed: boolean }
  | { allowed: false; reason: 'role' | 'state' | 'four-eyes'; message: string };

const pastTense: Record<WorkflowAction, string> = { submit: 'submitted', approve: 'approved', return: 'returned', publish: 'published' };

/**
 * The four-eyes rule: nobody who edited the content of the version under review may approve it,
 * unless the office allows self-approval.
 */
export function fourEyesVerdict(subject: Pick<TransitionSubject, 'userId' | 'reviewEditorIds' | 'allowSelfApproval'>): 'clear' | 'relaxed' | 'refused' {
  if (!subject.reviewEditorIds.includes(subject.userId)) return 'clear';
  return subject.allowSelfApproval ? 'relaxed' : 'refused';
}

/** Whether `action` may be taken now: role, state, then the four-eyes rule for approval. */
export function checkTransition(action: WorkflowAction, subject: TransitionSubject): TransitionVerdict {
  const rule = transitions[action];
  if (!rule.roles.includes(subject.role)) {
    return { allowed: false, reason: 'role', message: `Your role (${subject.role}) cannot ${action} an outlook; ${rule.roles.join(' or ')} can.` };
  }
  if (!rule.from.includes(subject.state)) {
    return { allowed: false, reason: 'state', message: `This outlook is ${outlookStatePhrases[subject.state]}; it cannot be ${pastTense[action]} now.` };
  }
  if (action === 'approve') {
    const fourEyes = fourEyesVerdict(subject);
    if (fourEyes === 'refused') {
      return { allowed: false, reason: 'four-eyes', message: 'You edited the content of this version, so another lead must approve it (four-eyes rule).' };
    }
    return { allowed: true, fourEyesRelaxed: fourEyes === 'relaxed' };
  }
  return { allowed: true, fourEyesRelaxed: false };
}

/** The actions open to the subject now, in offering order: the client's buttons. */
export function availableActions(subject: TransitionSubject): WorkflowAction[] {
  return workflowActionOrder.filter((action) => checkTransition(action, subject).allowed);
}
