import type { OutlookState } from '../../../../shared/contracts/outlooks';

/**
 * Query keys of the review feature, general to specific. A workflow action or a comment
 * invalidates `reviewKeys.all`; the authoring workspace's own cache (`outlooksKeys`, prefix
 * `outlooksPrefix`) and the public issuances (`issuancesPrefix`) are invalidated too, since a
 * state change or a publication changes what those pages show.
 */
export const reviewKeys = {
  all: ['review'] as const,
  queue: (states: readonly OutlookState[]) => [...reviewKeys.all, 'queue', states] as const,
  outlook: (outlookId: string) => [...reviewKeys.all, 'outlook', outlookId] as const,
  evidence: (outlookId: string) => [...reviewKeys.all, 'evidence', outlookId] as const,
  revisions: (outlookId: string) => [...reviewKeys.all, 'revisions', outlookId] as const,
  revision: (revisionId: string) => [...reviewKeys.all, 'revision', revisionId] as const,
  comments: (outlookId: string) => [...reviewKeys.all, 'comments', outlookId] as const,
  audit: (outlookId: string) => [...reviewKeys.all, 'audit', outlookId] as const,
  currentIssuances: () => [...reviewKeys.all, 'current-issuances'] as const,
};

/** Prefixes owned by other features, invalidated after a workflow action (never used as query keys here). */
export const outlooksPrefix = ['outlooks'] as const;
export const issuancesPrefix = ['issuances'] as const;
