import { clsx } from 'clsx';
import type { Units } from '../../../../shared/contracts/users';
import type { ParcelResult, SoundingAnalysis } from '../../../../shared/sounding';
import { indexGroups } from './index-rows';

export interface IndexPanelProps {
  analysis: SoundingAnalysis;
  units: Units;
  /** A parcel lifted from a chosen level (what-if), shown beside the standard parcels. */
  chosenParcel?: ParcelResult | null;
  className?: string;
}

/** The sounding's indices in five groups, in the person's units. */
export function IndexPanel({ analysis, units, chosenParcel = null, className }: IndexPanelProps) {
  const groups = indexGroups(analysis, units, chosenParcel);
  return (
    <div className={clsx('gap-6 sm:columns-2 xl:columns-3', className)}>
      {groups.map((group) => (
        <table key={group.title} className="mb-4 w-full break-inside-avoid border-collapse text-[13px] tabular-nums">
          <caption className="border-b border-line pb-1 text-left text-[12px] font-semibold tracking-wide text-ink-muted uppercase">{group.title}</caption>
          <tbody>
            {group.rows.map((row) => (
              <tr key={row.label} className="border-b border-line/60 last:border-0">
                <th scope="row" className="py-1 pr-2 text-left font-normal text-ink-muted" title={row.description}>
                  {row.label}
                </th>
                <td className="py-1 text-right font-medium text-ink" title={row.missingReason ?? undefined}>
                  {row.value}
                  {row.missingReason ? <span className="sr-only"> ({row.missingReason})</span> : null}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      ))}
    </div>
  );
}
