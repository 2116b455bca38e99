import { Component, type ErrorInfo, type ReactNode } from 'react';
import { isRouteErrorResponse, useRouteError } from 'react-router';
import { isApiError } from '../lib/api-client';
import { NotFoundPage } from './not-found';

/** A message for a person, never the raw exception text. */
export function readableMessage(error: unknown): string {
  if (isApiError(error)) return error.message;
  if (error instanceof Error && /dynamically imported module|Importing a module script failed/i.test(error.message)) {
    return 'A newer version of Stormdraft may be available. Reload the page to continue.';
  }
  return 'Something went wrong on this page. Reload to try again; if it keeps happening, tell your administrator what you were doing.';
}

function ErrorScreen({ message }: { message: string }) {
  return (
    <main id="main" role="alert" className="mx-auto flex min-h-dvh max-w-lg flex-col justify-center px-6">
      <h1 className="text-2xl font-semibold tracking-tight">This page stopped working</h1>
      <p className="mt-2 text-sm text-ink-muted">{message}</p>
      <div className="mt-6 flex gap-2">
        <button
          type="button"
          onClick={() => window.location.reload()}
          className="inline-flex h-9 items-center rounded-md bg-accent px-3.5 text-sm font-medium text-white hover:bg-accent-strong"
        >
          Reload
        </button>
        <a href="/" className="inline-flex h-9 items-center rounded-md border border-line-strong bg-panel px-3.5 text-sm font-medium">
          Go to the start page
        </a>
      </div>
    </main>
  );
}

/** The router's error element: 404 responses get the 404 page, everything else a readable screen. */
export function RouteErrorPage() {
  const error = useRouteError();
  if (isRouteErrorResponse(error) && error.status === 404) return <NotFoundPage />;
  console.error(error);
  return <ErrorScreen message={readableMessage(error)} />;
}

interface BoundaryState {
  error: unknown;
}

/** Last line of defence outside the router (providers, the router itself). */
export class AppErrorBoundary extends Component<{ children: ReactNode }, BoundaryState> {
  override state: BoundaryState = { error: null };

  static getDerivedStateFromError(error: unknown): BoundaryState {
    return { error };
  }

  override componentDidCatch(error: unknown, info: ErrorInfo) {
    console.error(error, info.componentStack);
  }

  override render() {
    if (this.state.error !== null) return <ErrorScreen message={readableMessage(this.state.error)} />;
    return this.props.children;
  }
}
