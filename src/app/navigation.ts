import type { Role } from '../../shared/contracts/common';

export type NavigationIcon = 'desk' | 'soundings' | 'review' | 'alerts' | 'users' | 'settings' | 'mail' | 'bulletin' | 'account' | 'webhooks' | 'verification' | 'intake';

export interface NavigationItem {
  label: string;
  to: string;
  icon: NavigationIcon;
}

const desk: NavigationItem = { label: 'Forecast desk', to: '/desk', icon: 'desk' };
const soundings: NavigationItem = { label: 'Soundings', to: '/soundings', icon: 'soundings' };
const review: NavigationItem = { label: 'Review queue', to: '/review', icon: 'review' };
const alerts: NavigationItem = { label: 'My alerts', to: '/alerts', icon: 'alerts' };
const users: NavigationItem = { label: 'Users', to: '/admin/users', icon: 'users' };
const settings: NavigationItem = { label: 'Office settings', to: '/admin/settings', icon: 'settings' };
const mail: NavigationItem = { label: 'Mail catcher', to: '/admin/mail', icon: 'mail' };
const subscribers: NavigationItem = { label: 'Subscribers', to: '/subscribers', icon: 'alerts' };
const outbox: NavigationItem = { label: 'Outbox', to: '/admin/outbox', icon: 'mail' };
const intake: NavigationItem = { label: 'Intake', to: '/intake', icon: 'intake' };
const verification: NavigationItem = { label: 'Verification', to: '/verification', icon: 'verification' };
const bulletin: NavigationItem = { label: 'Public bulletin', to: '/bulletin', icon: 'bulletin' };
const account: NavigationItem = { label: 'Account', to: '/account', icon: 'account' };
const webhooks: NavigationItem = { label: 'Webhooks', to: '/webhooks', icon: 'webhooks' };

/** The left navigation for a role, home first. Route guards use the same roles (router.tsx). */
export function navigationFor(role: Role): NavigationItem[] {
  switch (role) {
    case 'forecaster':
      return [desk, soundings, intake, verification, bulletin, account];
    case 'lead':
      return [review, desk, soundings, intake, verification, subscribers, bulletin, account];
    case 'subscriber':
      return [alerts, webhooks, bulletin, account];
    case 'admin':
      return [users, settings, subscribers, outbox, webhooks, mail, soundings, intake, verification, bulletin, account];
  }
}
