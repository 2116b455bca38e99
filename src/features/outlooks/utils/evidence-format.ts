import type { EvidenceParameterKey } from '../../../../shared/evidence/evidence';
import type { UnitFormatters } from '../../../hooks/use-units';
import { CELSIUS_ZERO_K, formatNumber } from '../../../utils/units';

/** A parameter value in the person's display units (temperature, height and speed follow their choice). */
export function formatEvidenceValue(key: EvidenceParameterKey, value: number, units: UnitFormatters): string {
  switch (key) {
    case 'mlLclHeightM':
      return units.height(value);
    case 'surfaceDewpointC':
      return units.temperature(value + CELSIUS_ZERO_K);
    case 'bulkShear0to6kmMs':
      return units.speed(value);
    case 'mlCape':
    case 'muCape':
    case 'mlCin':
      return `${formatNumber(value, 0)}\u202fJ/kg`;
    case 'surfaceMixingRatioGkg':
      return `${formatNumber(value, 1)}\u202fg/kg`;
    case 'precipitableWaterMm':
      return `${formatNumber(value, 0)}\u202fmm`;
    case 'srh0to1km':
      return `${formatNumber(value, 0)}\u202fm²/s²`;
    case 'stp':
    case 'scp':
      return formatNumber(value, 1);
    default:
      return formatNumber(value, 1);
  }
}
