import type { ReactNode } from 'react';

interface EmptyStateProps {
  icon?: ReactNode;
  title: string;
  children?: ReactNode;
  actions?: ReactNode;
}

/** What is missing, why, and what happens next — never fake data. */
export function EmptyState({ icon, title, children, actions }: EmptyStateProps) {
  return (
    <section className="rounded-lg border border-dashed border-line-strong bg-panel px-6 py-10 text-center">
      {icon ? <div className="mx-auto mb-3 flex size-10 items-center justify-center rounded-full bg-sunken text-ink-muted">{icon}</div> : null}
      <h2 className="text-base font-semibold text-ink">{title}</h2>
      {children ? <div className="mx-auto mt-1.5 max-w-md text-sm text-ink-muted">{children}</div> : null}
      {actions ? <div className="mt-4 flex justify-center gap-2">{actions}</div> : null}
    </section>
  );
}
