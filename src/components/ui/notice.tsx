import { clsx } from 'clsx';
import { CircleAlert, CircleCheck, Info, TriangleAlert } from 'lucide-react';
import type { ReactNode } from 'react';

type Tone = 'info' | 'success' | 'warning' | 'error';

const tones: Record<Tone, { box: string; icon: ReactNode }> = {
  info: { box: 'border-line bg-accent-soft text-ink', icon: <Info aria-hidden className="size-4 text-accent" /> },
  success: { box: 'border-ok/30 bg-ok-soft text-ink', icon: <CircleCheck aria-hidden className="size-4 text-ok" /> },
  warning: {
    box: 'border-warning-line bg-warning-soft text-ink',
    icon: <TriangleAlert aria-hidden className="size-4 text-warning" />,
  },
  error: { box: 'border-danger/30 bg-danger-soft text-ink', icon: <CircleAlert aria-hidden className="size-4 text-danger" /> },
};

interface NoticeProps {
  tone?: Tone;
  title?: string;
  children?: ReactNode;
  actions?: ReactNode;
  className?: string;
}

/** An inline message box. Errors are announced (`role="alert"`), the rest politely (`status`). */
export function Notice({ tone = 'info', title, children, actions, className }: NoticeProps) {
  const style = tones[tone];
  return (
    <div role={tone === 'error' ? 'alert' : 'status'} className={clsx('flex gap-2.5 rounded-md border px-3 py-2.5 text-sm', style.box, className)}>
      <span className="mt-0.5 shrink-0">{style.icon}</span>
      <div className="min-w-0 flex-1">
        {title ? <p className="font-semibold">{title}</p> : null}
        {children ? <div className={clsx(title && 'mt-0.5', 'text-ink-muted')}>{children}</div> : null}
        {actions ? <div className="mt-2 flex flex-wrap gap-2">{actions}</div> : null}
      </div>
    </div>
  );
}
