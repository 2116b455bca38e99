import { clsx } from 'clsx';
import { Bell, ChartScatter, ChartSpline, CircleUserRound, ClipboardCheck, FolderInput, Inbox, LogOut, Menu, Newspaper, PencilRuler, Settings2, Users, Webhook, X, type LucideIcon } from 'lucide-react';
import { useState } from 'react';
import { NavLink } from 'react-router';
import type { Me } from '../../../shared/contracts/users';
import { roleName } from '../../utils/roles';
import { navigationFor, type NavigationIcon } from '../navigation';

const icons: Record<NavigationIcon, LucideIcon> = {
  desk: PencilRuler,
  soundings: ChartSpline,
  review: ClipboardCheck,
  alerts: Bell,
  users: Users,
  settings: Settings2,
  mail: Inbox,
  bulletin: Newspaper,
  account: CircleUserRound,
  webhooks: Webhook,
  verification: ChartScatter,
  intake: FolderInput,
};

interface AppNavProps {
  user: Me['user'];
  onSignOut: () => void;
  signingOut: boolean;
}

/**
 * The slim left navigation: the role's pages, who is signed in, and sign-out. Below the md
 * breakpoint (phones) it collapses into a menu button that opens the same list.
 */
export function AppNav({ user, onSignOut, signingOut }: AppNavProps) {
  const items = navigationFor(user.role);
  const [open, setOpen] = useState(false);
  return (
    <nav aria-label="Main" className="flex w-full shrink-0 flex-col border-b border-line bg-panel md:w-52 md:border-r md:border-b-0">
      <div className="flex items-center gap-2 px-3 py-1.5 md:hidden">
        <button
          type="button"
          aria-expanded={open}
          aria-controls="main-navigation"
          onClick={() => setOpen((value) => !value)}
          className="flex items-center gap-1.5 rounded-md px-2 py-1.5 text-sm font-semibold text-ink hover:bg-sunken"
        >
          {open ? <X aria-hidden className="size-4" /> : <Menu aria-hidden className="size-4" />}
          Menu
        </button>
        <span className="ml-auto min-w-0 truncate text-[13px] text-ink-muted">
          {user.name} · {roleName(user.role)}
        </span>
      </div>
      <div id="main-navigation" className={clsx('flex-1 flex-col md:flex', open ? 'flex' : 'hidden')}>
        <ul className="flex flex-1 flex-col gap-0.5 p-2">
          {items.map((item) => {
            const Icon = icons[item.icon];
            return (
              <li key={item.to}>
                <NavLink
                  to={item.to}
                  onClick={() => setOpen(false)}
                  className={({ isActive }) =>
                    clsx(
                      'flex items-center gap-2.5 rounded-md px-2.5 py-2 text-sm md:py-1.5',
                      isActive ? 'bg-accent-soft font-semibold text-accent-strong' : 'text-ink-muted hover:bg-sunken hover:text-ink',
                    )
                  }
                >
                  <Icon aria-hidden className="size-4 shrink-0" />
                  {item.label}
                </NavLink>
              </li>
            );
          })}
        </ul>
        <div className="border-t border-line p-3">
          <p className="truncate text-sm font-semibold text-ink">{user.name}</p>
          <p className="truncate text-[13px] text-ink-muted">{roleName(user.role)}</p>
          <button
            type="button"
            onClick={onSignOut}
            disabled={signingOut}
            className="mt-2 flex items-center gap-1.5 rounded px-1 py-0.5 text-[13px] font-medium text-ink-muted hover:text-ink disabled:opacity-60"
          >
            <LogOut aria-hidden className="size-3.5" />
            {signingOut ? 'Signing out…' : 'Sign out'}
          </button>
        </div>
      </div>
    </nav>
  );
}
