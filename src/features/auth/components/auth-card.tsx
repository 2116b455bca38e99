import type { ReactNode } from 'react';

interface AuthCardProps {
  title: string;
  description?: ReactNode;
  children: ReactNode;
  footer?: ReactNode;
}

/** The narrow card every sign-in, registration and reset page sits in. */
export function AuthCard({ title, description, children, footer }: AuthCardProps) {
  return (
    <div className="mx-auto w-full max-w-sm">
      <div className="rounded-lg border border-line bg-panel p-6 shadow-sm">
        <h1 className="text-lg font-semibold tracking-tight">{title}</h1>
        {description ? <p className="mt-1 text-sm text-ink-muted">{description}</p> : null}
        <div className="mt-5">{children}</div>
      </div>
      {footer ? <div className="mt-4 space-y-1 text-center text-sm text-ink-muted">{footer}</div> : null}
    </div>
  );
}
