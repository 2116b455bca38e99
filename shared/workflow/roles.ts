import type { Role } from '../contracts/common';

/**
 * The role sets of the product, each named for what it grants. "Staff" is ambiguous (it has meant
 * authors, office readers and admin-made accounts), so no set is called that.
 */

/** Write outlooks and soundings: create and edit drafts, submit, comment, upload, amend. */
export const authoringRoles = ['forecaster', 'lead'] as const satisfies readonly Role[];

/** Review: return, approve, publish and withdraw (senior forecasters). */
export const reviewingRoles = ['lead'] as const satisfies readonly Role[];

/** Read the office's working material (outlooks, soundings, revisions, comments, audit). */
export const officeReaderRoles = ['forecaster', 'lead', 'admin'] as const satisfies readonly Role[];

/** Accounts only an admin creates (subscribers register themselves). */
export const adminCreatedRoles = ['forecaster', 'lead', 'admin'] as const satisfies readonly Role[];

/** See the list of subscribers and their areas of interest. */
export const subscriberOverseerRoles = ['lead', 'admin'] as const satisfies readonly Role[];

/** Users, office settings, mail catcher and outbox. */
export const adminRoles = ['admin'] as const satisfies readonly Role[];

/** Register webhook endpoints: subscribers for their own systems, admins for agencies. */
export const webhookManagerRoles = ['subscriber', 'admin'] as const satisfies readonly Role[];

/** See the intake (files taken in from the folder and scheduled pulls): forecasters and admins. */
export const intakeViewerRoles = ['forecaster', 'lead', 'admin'] as const satisfies readonly Role[];

/** Configure scheduled pull sources (addresses and credentials). */
export const intakeManagerRoles = ['admin'] as const satisfies readonly Role[];

/** Manage their own areas of interest and alert thresholds. */
export const subscriberRoles = ['subscriber'] as const satisfies readonly Role[];

export const roleLabels: Record<Role, string> = {
  forecaster: 'Forecaster',
  lead: 'Lead forecaster',
  subscriber: 'Subscriber',
  admin: 'Administrator',
};

/** Whether `role` is one of `allowed` (a role set above). */
export function hasRole(role: Role, allowed: readonly Role[]): boolean {
  return allowed.includes(role);
}
