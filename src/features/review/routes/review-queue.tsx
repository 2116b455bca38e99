import { ClipboardCheck } from 'lucide-react';
import { EmptyState } from '../../../components/ui/empty-state';
import { PageHeader } from '../../../components/ui/page-header';

/** The lead forecaster's home: drafts submitted for review. */
export function ReviewQueuePage() {
  return (
    <>
      <PageHeader
        title="Review queue"
        description="Drafts submitted by forecasters, waiting for you to return them with comments or approve and publish."
      />
      <EmptyState icon={<ClipboardCheck aria-hidden className="size-5" />} title="No outlooks in review.">
        When a forecaster submits a draft, it appears here with its risk areas and evidence. You cannot approve a draft you
        last edited yourself; another lead reviews those.
      </EmptyState>
    </>
  );
}
