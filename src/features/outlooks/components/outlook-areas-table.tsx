import { clsx } from 'clsx';
import { RiskSwatch } from '../../../components/ui/risk-swatch';
import type { RiskLadder } from '../../../../shared/contracts/office';
import type { AreaEvidenceReport } from '../../../../shared/contracts/outlooks';
import { ladderLevel } from '../../../../shared/workflow/levels';
import type { DraftArea } from '../utils/outlook-document';
import { SupportBadge } from './evidence-panel';

/** One row per area: level, label, soundings inside and the support result; a row click selects the area. */
export function OutlookAreasTable({ areas, ladder, reports, selectedId, onSelect }: { areas: DraftArea[]; ladder: RiskLadder; reports: Map<string, AreaEvidenceReport>; selectedId: string | null; onSelect: (id: string) => void }) {
  if (areas.length === 0) return <p className="text-[13px] text-ink-muted">No risk areas yet. Draw one with “Draw area” (N) or import a GeoJSON file.</p>;
  return (
    <table className="w-full text-[13px]">
      <caption className="sr-only">Risk areas of this outlook with their support check</caption>
      <thead className="text-left text-[12px] text-ink-faint">
        <tr>
          <th scope="col" className="py-1 font-medium">
            Level
          </th>
          <th scope="col" className="font-medium">
            Soundings
          </th>
          <th scope="col" className="font-medium">
            Support
          </th>
        </tr>
      </thead>
      <tbody>
        {areas.map((area) => {
          const level = ladderLevel(ladder, area.levelKey);
          const report = reports.get(area.id);
          return (
            <tr key={area.id} className={clsx('border-t border-line', area.id === selectedId && 'bg-accent-soft')}>
              <th scope="row" className="py-1.5 pr-2 text-left font-normal">
                <button type="button" className="text-left" onClick={() => onSelect(area.id)}>
                  <span className="sr-only">Select </span>
                  <RiskSwatch label={level.label} colour={level.colour} />
                  {area.label ? <span className="mt-0.5 block text-[12px] text-ink-muted"> {area.label}</span> : null}
                </button>
              </th>
              <td className="pr-2">{report ? report.evidence.count : '…'}</td>
              <td>{report ? <SupportBadge result={report.support.result} /> : <span className="text-[12px] text-ink-faint">after save</span>}</td>
            </tr>
          );
        })}
      </tbody>
    </table>
  );
}
