import { clsx } from 'clsx';
import { hazardFormLabel } from '../../../../shared/evidence/guidance';
import { supportResultLabels, type SupportResult } from '../../../../shared/evidence/support-check';
import type { OfficeSettings } from '../../../../shared/contracts/office';
import type { Outlook } from '../../../../shared/contracts/outlooks';
import { RiskSwatch } from '../../../components/ui/risk-swatch';
import type { AreaEvidenceReport } from '../../../../shared/contracts/outlooks';
import { levelLabel } from '../../../../shared/workflow/levels';
import { levelColour } from '../utils/review-map-areas';

const resultStyle: Record<SupportResult, string> = {
  supported: 'bg-ok-soft text-ok',
  thin: 'bg-warning-soft text-warning',
  exceeds: 'bg-accent-soft text-accent-strong',
  none: 'bg-danger-soft text-danger',
};

/** The support check and geometry checks of every area, as the server computed them. */
export function SupportResults({ reports, areas, ladder }: { reports: readonly AreaEvidenceReport[]; areas: Outlook['areas']; ladder: OfficeSettings['riskLadder'] }) {
  if (reports.length === 0) return <p className="text-sm text-ink-muted">This outlook has no risk areas to check.</p>;
  return (
    <ul className="space-y-3">
      {reports.map((report) => {
        const area = areas.find((a) => a.id === report.areaId);
        return (
          <li key={report.areaId} className="text-sm">
            <div className="flex flex-wrap items-center gap-2">
              <RiskSwatch label={levelLabel(ladder, report.levelKey)} colour={levelColour(ladder, report.levelKey)} />
              {area?.label ? <span>{area.label}</span> : null}
              <span className={clsx('rounded px-1.5 py-0.5 text-xs font-semibold', resultStyle[report.support.result])}>{supportResultLabels[report.support.result]}</span>
              <span className="text-[13px] text-ink-muted">
                {report.evidence.count} sounding{report.evidence.count === 1 ? '' : 's'} inside
              </span>
            </div>
            {report.support.reasons.length ? (
              <ul className="mt-1 list-disc pl-5 text-[13px] text-ink-muted">
                {report.support.reasons.map((reason) => (
                  <li key={reason}>{reason}</li>
                ))}
              </ul>
            ) : null}
            {report.support.hazards.length ? (
              <ul className="mt-1.5 space-y-1 border-l-2 border-line pl-3" aria-label={`Hazard checks${area?.label ? ` of ${area.label}` : ''}`}>
                {report.support.hazards.map((judgement) => (
                  <li key={`${judgement.hazard}-${judgement.significant}`}>
                    <span className="font-medium first-letter:uppercase">{hazardFormLabel(judgement.hazard, judgement.significant)}</span>{' '}
                    <span className={clsx('rounded px-1.5 py-0.5 text-xs font-semibold', resultStyle[judgement.result])}>{supportResultLabels[judgement.result]}</span>
                    {judgement.reasons.length ? <span className="block text-[13px] text-ink-muted">{judgement.reasons.join('. ')}</span> : null}
                  </li>
                ))}
              </ul>
            ) : null}
            {report.checks.map((check) => (
              <p key={check.code} className={clsx('mt-1 text-[13px]', check.severity === 'error' ? 'text-danger' : 'text-warning')}>
                {check.severity === 'error' ? 'Error: ' : 'Check: '}
                {check.message}
              </p>
            ))}
          </li>
        );
      })}
    </ul>
  );
}
