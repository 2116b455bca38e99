import { createContext, useContext, type ReactNode } from 'react';
import { createPortal } from 'react-dom';
import { useNow } from '../../hooks/use-now';
import { readClock } from '../../utils/time';

function Clock({ instant, timeZone, label }: { instant: Date; timeZone: string; label: string }) {
  const reading = readClock(instant, timeZone);
  return (
    <span className="flex items-baseline gap-1.5" aria-label={`${label}: ${reading.date} ${reading.time} ${reading.zone}`}>
      <span className="text-strip-faint">{reading.date}</span>
      <time className="font-semibold text-white" dateTime={instant.toISOString()}>
        {reading.time}
      </time>
      <span className="text-strip-faint">{reading.zone}</span>
    </span>
  );
}

/**
 * Where pages put their own status (outlook state, valid time): the strip renders an empty slot
 * and `<StatusStripContent>` portals into it from anywhere below the layout.
 */
const StatusStripSlotContext = createContext<HTMLElement | null>(null);

export function StatusStripContent({ children }: { children: ReactNode }) {
  const slot = useContext(StatusStripSlotContext);
  return slot ? createPortal(children, slot) : null;
}

interface StatusStripProps {
  officeName: string | undefined;
  timeZone: string | undefined;
  /** Extra status placed after the office name; pages can also use `<StatusStripContent>`. */
  children?: ReactNode;
  onSlot?: (element: HTMLElement | null) => void;
}

export function StatusStrip({ officeName, timeZone, children, onSlot }: StatusStripProps) {
  const now = useNow();
  return (
    <div
      role="region"
      aria-label="Status"
      className="flex min-h-10 shrink-0 flex-wrap items-center gap-x-4 gap-y-1 border-b border-black/20 bg-strip px-3 py-1.5 text-[13px] text-strip-ink sm:px-4"
    >
      <span className="flex items-center gap-2 font-semibold text-white">
        <span aria-hidden className="flex gap-0.5">
          <span className="h-3 w-1 rounded-sm bg-risk-level1" />
          <span className="h-3 w-1 rounded-sm bg-risk-level3" />
          <span className="h-3 w-1 rounded-sm bg-risk-level4" />
        </span>
        Stormdraft
      </span>
      <span aria-hidden className="hidden h-4 w-px bg-white/20 sm:inline" />
      <span className="min-w-0 truncate">{officeName ?? 'Loading office…'}</span>
      {children}
      <span ref={onSlot} className="flex min-w-0 flex-wrap items-center gap-x-3 gap-y-1" />
      <span className="ml-auto flex shrink-0 flex-wrap items-center gap-x-4 gap-y-1">
        <Clock instant={now} timeZone="UTC" label="Time in UTC" />
        {timeZone ? <Clock instant={now} timeZone={timeZone} label="Office local time" /> : null}
      </span>
    </div>
  );
}

export function StatusStripSlotProvider({ slot, children }: { slot: HTMLElement | null; children: ReactNode }) {
  return <StatusStripSlotContext.Provider value={slot}>{children}</StatusStripSlotContext.Provider>;
}
