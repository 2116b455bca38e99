import { PencilRuler } from 'lucide-react';
import { EmptyState } from '../../../components/ui/empty-state';
import { PageHeader } from '../../../components/ui/page-header';

/** The forecaster's home: drafts in progress. Drafting arrives with the authoring workspace. */
export function DeskPage() {
  return (
    <>
      <PageHeader title="Forecast desk" description="Your Day 1, Day 2 and Day 3 outlook drafts and their state." />
      <EmptyState icon={<PencilRuler aria-hidden className="size-5" />} title="No draft outlooks yet.">
        When the authoring workspace opens, you will start a draft here, draw its risk areas on the map and back each one
        with soundings before submitting it for review.
      </EmptyState>
    </>
  );
}
