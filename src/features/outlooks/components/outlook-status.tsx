import { StatusStripContent } from '../../../app/layouts/status-strip';
import type { OutlookState } from '../../../../shared/contracts/outlooks';
import { outlookStateLabels } from '../../../../shared/workflow/states';
import { formatPeriod } from '../utils/valid-period';

/** The outlook's state and valid time (UTC and office local) in the status strip. */
export function OutlookStatus({ day, state, validFrom, validUntil, timeZone }: { day: number; state: OutlookState; validFrom: string; validUntil: string; timeZone: string }) {
  return (
    <StatusStripContent>
      <span aria-hidden className="h-4 w-px bg-white/20" />
      <span className="font-semibold text-white">Day {day}</span>
      <span className="rounded bg-white/15 px-1.5 py-0.5 text-[12px] font-semibold text-white" aria-label={`Outlook state: ${outlookStateLabels[state]}`}>
        {outlookStateLabels[state]}
      </span>
      <span className="truncate" aria-label="Valid period">
        Valid {formatPeriod(validFrom, validUntil, 'UTC')}
        <span className="text-strip-faint"> · {formatPeriod(validFrom, validUntil, timeZone)}</span>
      </span>
    </StatusStripContent>
  );
}
