import { RiskSwatch } from '../../../components/ui/risk-swatch';
import type { OfficeSettings } from '../../../../shared/contracts/office';
import { formatKm2, type OutlookDiff } from '../utils/outlook-diff';
import { areaTitle, levelLabel } from '../../../../shared/workflow/levels';
import { levelColour } from '../utils/review-map-areas';

/** What the draft changes compared with the baseline: areas, levels, and ground per level. */
export function ChangeSummary({ diff, ladder, baselineName }: { diff: OutlookDiff; ladder: OfficeSettings['riskLadder']; baselineName: string }) {
  if (diff.unchanged) return <p className="text-sm text-ink-muted">No change to the risk areas compared with {baselineName}.</p>;
  return (
    <div className="space-y-3 text-sm">
      <ul className="space-y-1">
        {diff.added.map((area) => (
          <li key={`added-${area.id}`}>
            <span className="font-semibold text-ok">Added</span> {areaTitle(ladder, area)}
          </li>
        ))}
        {diff.removed.map((area) => (
          <li key={`removed-${area.id}`}>
            <span className="font-semibold text-danger">Removed</span> {areaTitle(ladder, area)}
          </li>
        ))}
        {diff.levelChanges.map((change) => (
          <li key={`level-${change.afterId}`}>
            <span className="font-semibold">Level changed</span>
            {change.label ? ` (${change.label})` : ''}: {levelLabel(ladder, change.fromLevelKey)} → {levelLabel(ladder, change.toLevelKey)}
          </li>
        ))}
      </ul>
      <table className="w-full text-left">
        <caption className="sr-only">Ground covered per level</caption>
        <thead className="text-[13px] text-ink-muted">
          <tr>
            <th className="py-1 pr-2 font-medium">Level</th>
            <th className="py-1 pr-2 text-right font-medium">Before</th>
            <th className="py-1 pr-2 text-right font-medium">Now</th>
            <th className="py-1 pr-2 text-right font-medium">Gained</th>
            <th className="py-1 text-right font-medium">Lost</th>
          </tr>
        </thead>
        <tbody>
          {diff.perLevel.map((level) => (
            <tr key={level.levelKey} className="border-t border-line">
              <td className="py-1 pr-2">
                <RiskSwatch label={levelLabel(ladder, level.levelKey)} colour={levelColour(ladder, level.levelKey)} />
              </td>
              <td className="py-1 pr-2 text-right">{formatKm2(level.beforeKm2)}</td>
              <td className="py-1 pr-2 text-right">{formatKm2(level.afterKm2)}</td>
              <td className="py-1 pr-2 text-right text-ok">{level.gainedKm2 >= 1 ? `+${formatKm2(level.gainedKm2)}` : '—'}</td>
              <td className="py-1 text-right text-danger">{level.lostKm2 >= 1 ? `−${formatKm2(level.lostKm2)}` : '—'}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
