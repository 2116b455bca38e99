import { useState } from 'react';
import { Navigate, Outlet, useLocation, useNavigate } from 'react-router';
import { Loading } from '../../components/ui/loading';
import { Notice } from '../../components/ui/notice';
import { useMe } from '../../hooks/use-me';
import { useOffice } from '../../hooks/use-office';
import { useSignOut } from '../../features/auth/api/sign-out';
import { AppNav } from './app-nav';
import { StatusStrip, StatusStripSlotProvider } from './status-strip';

/** The signed-in shell: status strip across the top, navigation on the left, the page beside it. */
export function AppLayout() {
  const me = useMe();
  const office = useOffice();
  const signOut = useSignOut();
  const navigate = useNavigate();
  const location = useLocation();
  const [slot, setSlot] = useState<HTMLElement | null>(null);

  if (me.isPending) return <Loading label="Opening Stormdraft…" />;
  if (me.isError) {
    return (
      <main className="p-6">
        <Notice tone="error" title="We could not check your session">
          {me.error.message}
        </Notice>
      </main>
    );
  }
  if (me.data === null) {
    // Signing out empties the cache first; that is not a page to come back to after signing in.
    if (!signOut.isIdle) return <Navigate to="/sign-in" replace />;
    const next = `${location.pathname}${location.search}`;
    return <Navigate to={`/sign-in?next=${encodeURIComponent(next)}`} replace />;
  }

  const handleSignOut = () => {
    signOut.mutate(undefined, { onSettled: () => void navigate('/sign-in', { replace: true }) });
  };

  return (
    // Phones: the document scrolls (nothing is cut off); from md up, the page scrolls beside the navigation.
    <div className="flex min-h-dvh flex-col md:h-dvh">
      <a
        href="#main"
        className="sr-only focus:not-sr-only focus:absolute focus:top-2 focus:left-2 focus:z-50 focus:rounded focus:bg-panel focus:px-3 focus:py-2 focus:text-sm"
      >
        Skip to content
      </a>
      <StatusStrip officeName={office.data?.name} timeZone={office.data?.timeZone} onSlot={setSlot} />
      <div className="flex flex-1 flex-col md:min-h-0 md:flex-row">
        <AppNav user={me.data.user} onSignOut={handleSignOut} signingOut={signOut.isPending} />
        <main id="main" tabIndex={-1} className="min-w-0 flex-1 px-3 pt-4 focus:outline-none sm:px-6 sm:pt-5 md:overflow-y-auto">
          <StatusStripSlotProvider slot={slot}>
            <Outlet />
            <div className="h-6" aria-hidden />
          </StatusStripSlotProvider>
        </main>
      </div>
    </div>
  );
}
