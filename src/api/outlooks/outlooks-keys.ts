import type { OutlookListQuery } from '../../../shared/contracts/outlooks';

/**
 * The one query-key factory of the outlooks resource, general to specific: resource, kind,
 * params. The workspace, the desk and the review screen all read through it, so one outlook is
 * cached once. A save or a workflow action invalidates `outlooksKeys.all`.
 */
export const outlooksKeys = {
  all: ['outlooks'] as const,
  lists: () => [...outlooksKeys.all, 'list'] as const,
  list: (filters: OutlookListQuery) => [...outlooksKeys.lists(), filters] as const,
  details: () => [...outlooksKeys.all, 'detail'] as const,
  detail: (outlookId: string) => [...outlooksKeys.details(), outlookId] as const,
  evidence: (outlookId: string, source: EvidenceSource) => [...outlooksKeys.all, 'evidence', outlookId, source] as const,
  /** The soundings (and stored figures) the evidence report reads for the outlook's saved period; the live preview's input. */
  evidenceCandidates: (outlookId: string, validFrom: string, validUntil: string) => [...outlooksKeys.all, 'evidence-candidates', outlookId, { validFrom, validUntil }] as const,
  revisions: (outlookId: string) => [...outlooksKeys.all, 'revisions', outlookId] as const,
  revision: (revisionId: string) => [...outlooksKeys.all, 'revision', revisionId] as const,
  comments: (outlookId: string) => [...outlooksKeys.all, 'comments', outlookId] as const,
  audit: (outlookId: string) => [...outlooksKeys.all, 'audit', outlookId] as const,
  soundings: (validFrom: string, validUntil: string) => [...outlooksKeys.all, 'soundings', { validFrom, validUntil }] as const,
};

/** Which soundings count as evidence: all, or only observed or only model ones. */
export type EvidenceSource = 'all' | 'observed' | 'model';
