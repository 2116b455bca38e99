import type { StormReportView } from '../../../../shared/contracts/verification';
import { reportHazardLabels, type ReportHazard } from '../../../../shared/reports/storm-report';
import { isSignificantReport } from '../../../../shared/verification/score-issuance';
import type { MapMarker, MarkerShape } from '../../../lib/map/risk-area-types';

/** Our own report symbols: one shape per hazard, filled for the significant form. */
export const reportShapes: Record<ReportHazard, MarkerShape> = {
  tornado: 'triangle-down',
  hail: 'circle',
  wind: 'square',
  flood: 'diamond',
};

function magnitudeText(report: StormReportView): string {
  if (report.hazard === 'hail' && report.hailCm !== null) return `${report.hailCm} cm hail`;
  if (report.hazard === 'wind' && report.gustKmh !== null) return `${report.gustKmh} km/h gust${report.gustMeasured ? ' (measured)' : report.gustMeasured === false ? ' (estimated)' : ''}`;
  if (report.hazard === 'tornado' && report.efRating !== null) return `EF${report.efRating}`;
  return '';
}

/** A storm report as a map symbol, with a title in words (time UTC, hazard, magnitude, remark). */
export function reportMarker(report: StormReportView): MapMarker {
  const significant = isSignificantReport({ time: report.time, lat: report.latitude, lon: report.longitude, hazard: report.hazard, hailDiameterCm: report.hailCm, gustKmh: report.gustKmh, efRating: report.efRating });
  const parts = [`${report.time.slice(11, 16)} UTC`, reportHazardLabels[report.hazard], magnitudeText(report), report.remark].filter(Boolean);
  return { id: report.id, latitude: report.latitude, longitude: report.longitude, shape: reportShapes[report.hazard], filled: significant, title: parts.join(' · ') };
}
