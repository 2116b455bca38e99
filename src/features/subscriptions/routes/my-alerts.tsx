import type { QueryClient } from '@tanstack/react-query';
import { Caution } from '../../../components/ui/caution';
import { Loading } from '../../../components/ui/loading';
import { Notice } from '../../../components/ui/notice';
import { PageHeader } from '../../../components/ui/page-header';
import { Panel } from '../../../components/ui/panel';
import { officeQueryOptions, useOffice } from '../../../hooks/use-office';
import { mySubscriptionQueryOptions, useMySubscription } from '../api/get-my-subscription';
import { AlertSettingsFormPanel } from '../components/alert-settings-form';
import { AreasOfInterestPanel } from '../components/areas-of-interest-panel';
import { SubscriptionStanding } from '../components/subscription-standing';

export const myAlertsLoader = (queryClient: QueryClient) => () =>
  Promise.all([queryClient.prefetchQuery(mySubscriptionQueryOptions()), queryClient.prefetchQuery(officeQueryOptions())]);

/** The subscriber's home: their areas of interest and alert thresholds. */
export function MyAlertsPage() {
  const subscription = useMySubscription();
  const office = useOffice();

  return (
    <>
      <PageHeader
        title="My alerts"
        description="The areas you are responsible for, and the risk level at which we e-mail you about them."
      />
      {subscription.isPending || office.isPending ? <Loading label="Loading your alert settings…" /> : null}
      {subscription.isError ? (
        <Notice tone="error" title="We could not load your alert settings">
          {subscription.error.message}
        </Notice>
      ) : null}
      {office.isError ? (
        <Notice tone="error" title="We could not load the office settings">
          {office.error.message}
        </Notice>
      ) : null}
      {subscription.data && office.data ? (
        <div className="space-y-4">
          <SubscriptionStanding subscription={subscription.data} ladder={office.data.riskLadder} />
          <div className="grid grid-cols-[minmax(0,1fr)] items-start gap-4 xl:grid-cols-[minmax(0,1fr)_26rem]">
            <Panel title="Areas of interest" description="Alerts cover these areas only. Draw one on the map, or add a county or state.">
              <AreasOfInterestPanel subscription={subscription.data} region={office.data.region} />
            </Panel>
            <Panel title="Alert settings">
              <AlertSettingsFormPanel key={subscription.data.id} subscription={subscription.data} ladder={office.data.riskLadder} />
            </Panel>
          </div>
          <Caution />
        </div>
      ) : null}
    </>
  );
}
