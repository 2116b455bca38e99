import type { WorkflowAction } from '../../../../shared/contracts/workflow';

export interface ActionProblem {
  title: string;
  message: string;
  /** A stale copy: the person should reload before acting. */
  reload: boolean;
}

/** Turns a refused action into words: four-eyes (403), someone else changed it (409), or the server's message. */
export function actionProblem(action: WorkflowAction, status: number, serverMessage: string): ActionProblem {
  if (status === 403 && action === 'approve') return { title: 'Another lead must approve this outlook', message: serverMessage, reload: false };
  if (status === 403) return { title: 'You cannot do that', message: serverMessage, reload: false };
  if (status === 409) return { title: 'The outlook changed since you opened it', message: `${serverMessage} Your view has been refreshed; look again before you act.`, reload: true };
  return { title: 'That did not work', message: serverMessage, reload: false };
}

/** Audit actions in words ("submit" → "Submitted for review"). */
export function auditActionWords(action: string): string {
  switch (action) {
    case 'create':
      return 'Created the draft';
    case 'save':
      return 'Saved';
    case 'submit':
      return 'Submitted for review';
    case 'return':
      return 'Returned with comments';
    case 'approve':
      return 'Approved';
    case 'publish':
      return 'Published';
    case 'comment':
      return 'Commented';
    case 'amend':
      return 'Started an amendment';
    case 'withdraw':
      return 'Withdrew the issuance';
    case 'supersede':
      return 'Superseded the issuance';
    default:
      return action;
  }
}
