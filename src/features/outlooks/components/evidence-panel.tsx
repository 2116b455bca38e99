import { Link } from 'react-router';
import { evidenceParameters } from '../../../../shared/evidence/evidence';
import { supportResultLabels, type SupportResult } from '../../../../shared/evidence/support-check';
import type { UnitFormatters } from '../../../hooks/use-units';
import type { AreaEvidenceReport, ParameterStatsReport } from '../../../../shared/contracts/outlooks';
import { formatEvidenceValue } from '../utils/evidence-format';

export const supportTones: Record<SupportResult, string> = {
  supported: 'bg-ok-soft text-ok border-ok/30',
  thin: 'bg-warning-soft text-warning border-warning-line',
  exceeds: 'bg-accent-soft text-accent-strong border-accent/30',
  none: 'bg-sunken text-ink-muted border-line',
};

export function SupportBadge({ result }: { result: SupportResult }) {
  return <span className={`inline-flex rounded border px-1.5 py-0.5 text-[12px] font-semibold ${supportTones[result]}`}>{supportResultLabels[result]}</span>;
}

/** A small bar histogram (relative counts), described in words for screen readers. */
function MiniHistogram({ stats, label }: { stats: ParameterStatsReport; label: string }) {
  const peak = Math.max(1, ...stats.histogram.map((b) => b.count));
  const width = 64;
  const height = 18;
  const barWidth = width / Math.max(1, stats.histogram.length);
  return (
    <svg width={width} height={height} role="img" aria-label={`${label} histogram: ${stats.histogram.map((b) => b.count).join(', ')}`} className="shrink-0">
      <rect x={0} y={height - 1} width={width} height={1} fill="#b6c0cd" />
      {stats.histogram.map((bin, index) => {
        const h = (bin.count / peak) * (height - 2);
        return <rect key={index} x={index * barWidth + 0.5} y={height - 1 - h} width={Math.max(1, barWidth - 1)} height={h} fill="#3a50ad" />;
      })}
    </svg>
  );
}

interface EvidencePanelProps {
  report: Pick<AreaEvidenceReport, 'evidence' | 'support'> | undefined;
  stale: boolean;
  /** Computed in the browser from the soundings' stored figures while the draft is ahead of the server's answer. */
  preview?: boolean;
  units: UnitFormatters;
  stationOf: (soundingId: string) => string;
  /** Where the soundings inside came from, e.g. a model run and its count (the statistics cover them all). */
  sources?: { label: string; count: number }[];
}

/** The evidence for one area: count, min/median/p90/max per parameter with histograms, support check, sounding links. */
export function EvidencePanel({ report, stale, preview = false, units, stationOf, sources = [] }: EvidencePanelProps) {
  if (!report) {
    return <p className="text-[13px] text-ink-muted">Evidence appears once this area is saved (a couple of seconds after your last change).</p>;
  }
  const { evidence, support } = report;
  // Grid soundings (id `${runId}:${pointIndex}`) are counted per run below, not linked one by one.
  const linked = evidence.soundingIds.filter((id) => !id.includes(':'));
  return (
    <div className="space-y-3" aria-busy={stale || undefined} data-evidence={preview ? 'preview' : stale ? 'stale' : 'record'}>
      {preview ? (
        <p className="rounded border border-dashed border-accent/50 bg-accent-soft px-2 py-1 text-[12px] text-accent-strong" data-testid="evidence-preview">
          Live preview from the soundings’ stored figures; the server’s check after the next save is the record.
        </p>
      ) : stale ? (
        <p className="text-[12px] text-ink-faint">From the last save; updating after the next save.</p>
      ) : null}
      <div className="flex items-center justify-between gap-2">
        <p className="text-sm">
          <span className="font-semibold" data-testid="evidence-count">
            {evidence.count}
          </span>{' '}
          {evidence.count === 1 ? 'sounding' : 'soundings'} inside
          {evidence.flaggedCount > 0 ? (
            <span className="text-warning" data-testid="evidence-flagged-count">
              {' '}
              ({evidence.flaggedCount} with quality flags)
            </span>
          ) : null}
        </p>
        <span data-testid="support-result">
          <SupportBadge result={support.result} />
        </span>
      </div>
      <div>
        <h3 className="text-[13px] font-semibold">Support check</h3>
        <ul className="mt-1 list-disc space-y-0.5 pl-4 text-[13px] text-ink-muted">
          {support.reasons.map((reason) => (
            <li key={reason}>{reason}</li>
          ))}
        </ul>
      </div>
      {sources.length > 0 ? (
        <p className="text-[12px] text-ink-muted" data-testid="evidence-sources">
          Statistics from {sources.map((s) => `${s.label} (${s.count})`).join(', ')}
        </p>
      ) : null}
      {evidence.count > 0 ? (
        <table className="w-full text-[12px]">
          <caption className="sr-only">Parameters of the soundings inside the area</caption>
          <thead className="text-left text-ink-faint">
            <tr>
              <th scope="col" className="py-1 font-medium">
                Parameter
              </th>
              <th scope="col" className="font-medium">
                min
              </th>
              <th scope="col" className="font-medium">
                median
              </th>
              <th scope="col" className="font-medium">
                p90
              </th>
              <th scope="col" className="font-medium">
                max
              </th>
              <th scope="col">
                <span className="sr-only">Histogram</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {evidenceParameters.map(({ key, label }) => {
              const stats = evidence.stats[key];
              if (!stats) return null;
              return (
                <tr key={key} className="border-t border-line">
                  <th scope="row" className="py-1 pr-1 text-left font-medium">
                    {label}
                  </th>
                  <td className="pr-1">{formatEvidenceValue(key, stats.min, units)}</td>
                  <td className="pr-1 font-semibold">{formatEvidenceValue(key, stats.median, units)}</td>
                  <td className="pr-1">{formatEvidenceValue(key, stats.p90, units)}</td>
                  <td className="pr-1">{formatEvidenceValue(key, stats.max, units)}</td>
                  <td>
                    <MiniHistogram stats={stats} label={label} />
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      ) : null}
      {linked.length > 0 ? (
        <div>
          <h3 className="text-[13px] font-semibold">Soundings inside</h3>
          <ul className="mt-1 flex flex-wrap gap-1 text-[12px]">
            {linked.map((id) => (
              <li key={id}>
                <Link to={`/soundings/${id}`} className="rounded bg-sunken px-1.5 py-0.5 text-accent hover:underline">
                  {stationOf(id)}
                </Link>
              </li>
            ))}
          </ul>
        </div>
      ) : null}
    </div>
  );
}
