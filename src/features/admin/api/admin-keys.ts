/**
 * Query keys of the admin feature, general to specific: feature, resource, kind, params.
 * Writes invalidate a resource prefix (`users()`, `mail()`); office settings use `officeKeys`.
 */
export const adminKeys = {
  all: ['admin'] as const,
  users: () => [...adminKeys.all, 'users'] as const,
  userList: () => [...adminKeys.users(), 'list'] as const,
  mail: () => [...adminKeys.all, 'mail'] as const,
  mailList: () => [...adminKeys.mail(), 'list'] as const,
  mailDetail: (messageId: string) => [...adminKeys.mail(), 'detail', messageId] as const,
  outbox: () => [...adminKeys.all, 'outbox'] as const,
  outboxList: () => [...adminKeys.outbox(), 'list'] as const,
};
