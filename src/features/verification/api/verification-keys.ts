import type { VerificationSummaryQuery } from '../../../../shared/contracts/verification';

/** Query keys of the office's verification summary, general to specific. */
export const verificationKeys = {
  all: ['verification'] as const,
  summaries: () => [...verificationKeys.all, 'summary'] as const,
  summary: (query: VerificationSummaryQuery) => [...verificationKeys.summaries(), query] as const,
};
