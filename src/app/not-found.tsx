import { Link } from 'react-router';
import { ButtonLink } from '../components/ui/button';

export function NotFoundPage() {
  return (
    <main id="main" className="mx-auto flex min-h-dvh max-w-lg flex-col justify-center px-6">
      <p className="text-sm font-semibold text-accent tabular-nums">404</p>
      <h1 className="mt-1 text-2xl font-semibold tracking-tight">We could not find that page</h1>
      <p className="mt-2 text-sm text-ink-muted">
        The address may be mistyped, or the page may have moved. Published outlooks stay on the public bulletin.
      </p>
      <div className="mt-6 flex gap-2">
        <ButtonLink to="/">Go to the start page</ButtonLink>
        <ButtonLink to="/bulletin" variant="secondary">
          Open the bulletin
        </ButtonLink>
      </div>
      <p className="mt-8 text-[13px] text-ink-faint">
        <Link to="/" className="hover:underline">
          Stormdraft
        </Link>
      </p>
    </main>
  );
}
