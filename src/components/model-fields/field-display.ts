import type { RunBrief } from '../../../shared/contracts/model-fields';
import type { FieldQuantity } from '../../../shared/model-fields/field-bands';
import type { Units } from '../../../shared/contracts/users';
import { formatNumber, heightUnitLabel, metresPerSecondToKnots, metresPerSecondToMph, metresToFeet, speedUnitLabel, temperatureUnitLabel } from '../../utils/units';

/** A break of a field in the person's display units (temperature, height and speed convert; the rest stay SI). */
export function displayValue(valueSi: number, quantity: FieldQuantity | string, siUnit: string, units: Units): { value: number; unit: string } {
  switch (quantity) {
    case 'temperature':
      return units.temperature === 'F' ? { value: valueSi * 1.8 + 32, unit: temperatureUnitLabel.F } : { value: valueSi, unit: temperatureUnitLabel.C };
    case 'height':
      return units.height === 'ft' ? { value: metresToFeet(valueSi), unit: heightUnitLabel.ft } : { value: valueSi, unit: heightUnitLabel.m };
    case 'speed':
      return { value: units.speed === 'kt' ? metresPerSecondToKnots(valueSi) : units.speed === 'mph' ? metresPerSecondToMph(valueSi) : valueSi, unit: speedUnitLabel[units.speed] };
    default:
      return { value: valueSi, unit: siUnit };
  }
}

/** The range of one band in display units, e.g. "1,000–1,500 J/kg" or "≥ 4,000 J/kg". */
export function bandLabel(from: number, to: number | null, sense: 'above' | 'below', quantity: string, siUnit: string, units: Units): string {
  const a = displayValue(from, quantity, siUnit, units);
  const decimals = Math.abs(a.value) < 10 && !Number.isInteger(a.value) ? 1 : 0;
  const unit = a.unit === '' ? '' : `\u202f${a.unit}`;
  if (to === null) return `${sense === 'above' ? '≥' : '≤'} ${formatNumber(a.value, decimals)}${unit}`;
  const b = displayValue(to, quantity, siUnit, units);
  return `${formatNumber(a.value, decimals)} to ${formatNumber(b.value, decimals)}${unit}`;
}

/** How a run is named everywhere: model, cycle and forecast hour, e.g. "TESTNEST 2031-06-01 12Z +6 h". */
export function runName(run: Pick<RunBrief, 'model' | 'cycleTime' | 'forecastHour'>): string {
  return `${run.model} ${run.cycleTime.slice(0, 10)} ${run.cycleTime.slice(11, 13)}Z +${run.forecastHour} h`;
}

/** Per area, where its soundings came from, named for the evidence panel: each run, then observed and uploaded ones. */
export function evidenceSourceLabels(evidence: { runs: RunBrief[]; sourcesByArea: Record<string, { runId: string | null; count: number }[]> } | undefined, areaId: string): { label: string; count: number }[] {
  if (!evidence) return [];
  const runs = new Map(evidence.runs.map((r) => [r.id, r]));
  return (evidence.sourcesByArea[areaId] ?? []).map(({ runId, count }) => {
    const run = runId === null ? undefined : runs.get(runId);
    return { label: runId === null ? 'observed and uploaded soundings' : run ? runName(run) : 'a deleted model run', count };
  });
}
