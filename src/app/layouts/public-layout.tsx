import { Link, Outlet, useLocation } from 'react-router';
import { Caution } from '../../components/ui/caution';
import { useMe } from '../../hooks/use-me';
import { useOffice } from '../../hooks/use-office';
import { homePathFor } from '../../utils/roles';

/** Pages anyone can open: the bulletin and the sign-in family. Every one carries the caution. */
export function PublicLayout() {
  const office = useOffice();
  const me = useMe();
  const user = me.data?.user;
  // The bulletin shows the caution right under its heading; every other public page in the footer.
  const cautionInPage = useLocation().pathname === '/bulletin';
  return (
    <div className="flex min-h-dvh flex-col">
      <header className="border-b border-line bg-panel">
        <div className="mx-auto flex h-14 max-w-5xl items-center gap-3 px-5">
          <Link to="/" className="flex items-center gap-2 font-semibold text-ink">
            <span aria-hidden className="flex gap-0.5">
              <span className="h-4 w-1.5 rounded-sm bg-risk-level1" />
              <span className="h-4 w-1.5 rounded-sm bg-risk-level3" />
              <span className="h-4 w-1.5 rounded-sm bg-risk-level4" />
            </span>
            Stormdraft
          </Link>
          {office.data ? <span className="hidden truncate text-sm text-ink-muted sm:inline">· {office.data.name}</span> : null}
          <nav aria-label="Site" className="ml-auto flex items-center gap-4 text-sm whitespace-nowrap">
            <Link to="/bulletin" className="text-ink-muted hover:text-ink">
              Bulletin
            </Link>
            {user ? (
              <Link to={homePathFor(user.role)} className="font-medium text-accent hover:underline">
                Open your workspace
              </Link>
            ) : (
              <Link to="/sign-in" className="font-medium text-accent hover:underline">
                Sign in
              </Link>
            )}
          </nav>
        </div>
      </header>
      <main id="main" className="mx-auto w-full max-w-5xl flex-1 px-5 py-8">
        <Outlet />
      </main>
      {cautionInPage ? null : (
        <footer className="border-t border-line bg-panel">
          <div className="mx-auto max-w-5xl px-5 py-4">
            <Caution />
          </div>
        </footer>
      )}
    </div>
  );
}
