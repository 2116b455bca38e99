import { supportResultLabels, type SupportResult } from '../../../../shared/evidence/support-check';

const order: SupportResult[] = ['none', 'thin', 'exceeds', 'supported'];

/** "2 supported · 1 thin support" — counts of the support results, most worrying first. */
export function supportSummary(results: readonly SupportResult[]): string {
  if (results.length === 0) return 'No risk areas';
  return order
    .map((result) => ({ result, count: results.filter((r) => r === result).length }))
    .filter((entry) => entry.count > 0)
    .map((entry) => `${entry.count} ${supportResultLabels[entry.result]}`)
    .join(' · ');
}
