import { reportHazardLabels, reportHazards } from '../../../../shared/reports/storm-report';
import type { IssuanceVerification } from '../../../../shared/contracts/verification';
import { hazardLabels } from '../../../../shared/contracts/risk-areas';
import { Loading } from '../../../components/ui/loading';
import { Notice } from '../../../components/ui/notice';
import { RiskAreaMap } from '../../../lib/map/risk-area-map';
import { markerSvg } from '../../../lib/map/marker-symbol';
import type { Issuance } from '../api/issuance-schema';
import { useIssuanceVerification } from '../api/get-issuance-verification';
import { stepFor } from '../utils/issuance-format';
import { boundsOfAreas, mapAreasOf } from '../utils/map-areas';
import { reportMarker, reportShapes } from '../utils/report-symbols';

const score = (value: number | null, digits = 2) => (value === null ? '—' : value.toFixed(digits));

function ScoresTable({ caption, rows }: { caption: string; rows: { key: string; label: string; table: { hits: number; falseAlarms: number; misses: number; correctNegatives: number }; scores: { pod: number | null; successRatio: number | null; csi: number | null; bias: number | null } }[] }) {
  return (
    <div className="overflow-x-auto">
      <table className="w-full min-w-[36rem] text-left text-sm tabular-nums">
        <caption className="mb-1 text-left text-[13px] font-semibold">{caption}</caption>
        <thead className="text-[13px] text-ink-muted">
          <tr>
            <th scope="col" className="py-1 pr-3 font-medium">Forecast</th>
            <th scope="col" className="py-1 pr-2 text-right font-medium">Hits</th>
            <th scope="col" className="py-1 pr-2 text-right font-medium">False alarms</th>
            <th scope="col" className="py-1 pr-2 text-right font-medium">Misses</th>
            <th scope="col" className="py-1 pr-3 text-right font-medium">Correct negatives</th>
            <th scope="col" className="py-1 pr-2 text-right font-medium">POD</th>
            <th scope="col" className="py-1 pr-2 text-right font-medium">Success ratio</th>
            <th scope="col" className="py-1 pr-2 text-right font-medium">CSI</th>
            <th scope="col" className="py-1 text-right font-medium">Bias</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((row) => (
            <tr key={row.key} className="border-t border-line">
              <th scope="row" className="py-1 pr-3 font-medium">{row.label}</th>
              <td className="py-1 pr-2 text-right">{row.table.hits}</td>
              <td className="py-1 pr-2 text-right">{row.table.falseAlarms}</td>
              <td className="py-1 pr-2 text-right">{row.table.misses}</td>
              <td className="py-1 pr-3 text-right">{row.table.correctNegatives}</td>
              <td className="py-1 pr-2 text-right">{score(row.scores.pod)}</td>
              <td className="py-1 pr-2 text-right">{score(row.scores.successRatio)}</td>
              <td className="py-1 pr-2 text-right">{score(row.scores.csi)}</td>
              <td className="py-1 text-right">{score(row.scores.bias)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

function ScoredView({ issuance, verification }: { issuance: Issuance; verification: IssuanceVerification }) {
  const result = verification.result;
  if (!result) return null;
  const snapshot = issuance.snapshot;
  const ladder = snapshot.riskLadder;
  const areas = mapAreasOf(snapshot.areas, ladder);
  const bounds = snapshot.office.region ?? boundsOfAreas(snapshot.areas) ?? { west: -100, south: 30, east: -85, north: 45 };
  const levels = result.levels.map((l) => ({ key: l.levelKey, label: `${stepFor(ladder, l.levelKey).label} or higher`, table: l.table, scores: l.scores }));
  const flagged = new Set(snapshot.areas.flatMap((a) => a.hazards.map((h) => `${h.hazard}:${h.significant}`)));
  const hazards = result.hazards
    .filter((h) => h.reports > 0 || flagged.has(`${h.hazard}:${h.significant}`) || (!h.significant && flagged.has(`${h.hazard}:true`)))
    .map((h) => ({ key: `${h.hazard}:${h.significant}`, label: `${h.significant ? `Significant ${hazardLabels[h.hazard].toLowerCase()}` : hazardLabels[h.hazard]} (${h.reports} report${h.reports === 1 ? '' : 's'})`, table: h.table, scores: h.scores }));
  return (
    <div className="space-y-4">
      <p className="text-sm text-ink-muted">
        {verification.reports.length} storm report{verification.reports.length === 1 ? '' : 's'} fell in the region while this issuance was in force. Scores compare the forecast areas with
        the reports on a {result.method.gridSpacingKm} km equal-area grid ({result.cells.toLocaleString('en-US')} cells): a cell counts as observed when a report lies within{' '}
        {result.method.observedRadiusKm} km of it.
      </p>
      <div className="grid gap-3 lg:grid-cols-[minmax(0,1fr)_14rem]">
        <RiskAreaMap label={`Storm reports over the risk map of issuance ${issuance.number}`} bounds={bounds} areas={areas} markers={verification.reports.map(reportMarker)} className="h-[24rem] rounded-md border border-line" />
        <div>
          <h4 className="text-[13px] font-semibold">Report symbols</h4>
          <ul className="mt-1 space-y-1 text-sm">
            {reportHazards.map((hazard) => (
              <li key={hazard} className="flex items-center gap-2">
                <span className="inline-flex gap-0.5" dangerouslySetInnerHTML={{ __html: markerSvg(reportShapes[hazard], false) + markerSvg(reportShapes[hazard], true) }} />
                {reportHazardLabels[hazard]}
              </li>
            ))}
          </ul>
          <p className="mt-2 text-[13px] text-ink-muted">Filled: significant (tornado EF2+, hail 5 cm+, gust 120 km/h+).</p>
        </div>
      </div>
      <ScoresTable caption="By risk level: inside an area at or above the level vs any severe report" rows={levels} />
      {hazards.length ? <ScoresTable caption="By hazard: inside an area flagged with the hazard vs reports of that hazard" rows={hazards} /> : null}
      <p className="text-[13px] text-ink-muted">
        POD: share of observed cells inside the forecast. Success ratio: share of forecast cells that were observed (1 − false-alarm ratio). CSI: hits over hits, misses and false
        alarms. Bias: forecast cells over observed cells. The practically perfect hindcast (reports smoothed with a {result.method.smoothingLengthKm} km Gaussian) peaks at{' '}
        {Math.round(result.practicallyPerfect.max * 100)}%.
      </p>
    </div>
  );
}

/** After the valid period: the storm reports over the outlook map and the verification scores. */
export function VerificationPanel({ issuance }: { issuance: Issuance }) {
  const verification = useIssuanceVerification(issuance.number);
  return (
    <section aria-labelledby={`verification-${issuance.number}`} className="rounded-md border border-line bg-panel p-4">
      <h3 id={`verification-${issuance.number}`} className="mb-2 text-sm font-semibold">
        Verification
      </h3>
      {verification.isPending ? <Loading label="Loading the verification…" /> : null}
      {verification.isError ? <Notice tone="error" title="The verification could not be loaded">{verification.error.message}</Notice> : null}
      {verification.data?.status === 'pending' ? <p className="text-sm text-ink-muted">{verification.data.reason}</p> : null}
      {verification.data?.status === 'not_scored' ? <p className="text-sm text-ink-muted">Not scored. {verification.data.reason}</p> : null}
      {verification.data?.status === 'scored' ? <ScoredView issuance={issuance} verification={verification.data} /> : null}
    </section>
  );
}
