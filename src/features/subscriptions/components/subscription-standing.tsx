import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import type { RiskLadder } from '../../../../shared/contracts/office';
import { useUpdateMySubscription } from '../api/update-my-subscription';
import type { Subscription } from '../api/subscription-schemas';
import { formFromSubscription, payloadFromForm, standingOf } from '../utils/alert-settings';

/** The banner that says whether alerts are on, paused or stopped, with the one action that changes it. */
export function SubscriptionStanding({ subscription, ladder }: { subscription: Subscription; ladder: RiskLadder }) {
  const update = useUpdateMySubscription();
  const saved = formFromSubscription(subscription, ladder);
  const save = (paused: boolean) => update.mutate(payloadFromForm({ ...saved, paused }, subscription.version));
  const standing = standingOf(subscription);
  const problem = update.isError ? <p className="mt-1 text-danger">{update.error.message}</p> : null;

  switch (standing) {
    case 'unsubscribed':
      return (
        <Notice
          tone="warning"
          title="You are unsubscribed"
          actions={
            <Button onClick={() => save(false)} busy={update.isPending}>
              Subscribe again
            </Button>
          }
        >
          You used an unsubscribe link, so no outlook e-mails are sent to you. Your areas and settings are kept; subscribe again to start receiving alerts.
          {problem}
        </Notice>
      );
    case 'paused':
      return (
        <Notice
          tone="warning"
          title="Alerts are paused"
          actions={
            <Button onClick={() => save(false)} busy={update.isPending}>
              Resume alerts
            </Button>
          }
        >
          No e-mails are sent while alerts are paused. Resume them when you are back on duty.
          {problem}
        </Notice>
      );
    case 'no-areas':
    case 'active':
      return (
        <Notice
          tone={standing === 'active' ? 'success' : 'info'}
          title={standing === 'active' ? 'Alerts are on' : 'Alerts are on, but you have no areas yet'}
          actions={
            <Button variant="secondary" size="sm" onClick={() => save(true)} busy={update.isPending}>
              Pause alerts
            </Button>
          }
        >
          {standing === 'active'
            ? `We e-mail ${subscription.emails.join(', ')} when a published outlook reaches your threshold in one of your ${subscription.areas.length} area${subscription.areas.length === 1 ? '' : 's'}.`
            : 'Add an area of interest below, by drawing it or picking a county or state, so alerts can reach you.'}
          {problem}
        </Notice>
      );
  }
}
