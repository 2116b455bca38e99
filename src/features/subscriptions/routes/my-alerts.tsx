import { Bell } from 'lucide-react';
import { ButtonLink } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { PageHeader } from '../../../components/ui/page-header';

/** The subscriber's home: their areas of interest and alert thresholds. */
export function MyAlertsPage() {
  return (
    <>
      <PageHeader
        title="My alerts"
        description="The areas you are responsible for, and the risk level at which we e-mail you about them."
      />
      <EmptyState
        icon={<Bell aria-hidden className="size-5" />}
        title="No areas of interest yet."
        actions={
          <ButtonLink to="/bulletin" variant="secondary">
            Read the public bulletin
          </ButtonLink>
        }
      >
        Soon you will add your jurisdiction here — draw it or pick counties — and choose an alert threshold. Until then,
        the latest published outlook is on the public bulletin.
      </EmptyState>
    </>
  );
}
