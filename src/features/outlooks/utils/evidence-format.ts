import type { EvidenceParameterKey } from '../../../../shared/evidence/evidence';
import type { UnitFormatters } from '../../../hooks/use-units';
import { CELSIUS_ZERO_K, formatNumber } from '../../../utils/units';

/** A parameter value in the person's display units (temperature, height and speed follow their choice). */
export function formatEvidenceValue(key: EvidenceParameterKey, value: number, units: UnitFormatters): string {
  switch (key) {
    case 'mlLclHeightM':
    case 'mlLclLfcGapM':
    case 'freezingLevelM':
    case 'warmCloudDepthM':
      return units.height(value);
    case 'surfaceDewpointC':
      return units.temperature(value + CELSIUS_ZERO_K);
    case 'bulkShear0to6kmMs':
    case 'effectiveBulkShearMs':
    case 'bulkShear0to8kmMs':
    case 'meanWind0to6kmMs':
    case 'corfidiUpwindMs':
    case 'corfidiDownwindMs':
      return units.speed(value);
    case 'mlCape':
    case 'muCape':
    case 'mlCin':
    case 'muCapeHailZone':
    case 'dcape':
      return `${formatNumber(value, 0)}\u202fJ/kg`;
    case 'lapseRate0to3kmCKm':
    case 'lapseRate3to6kmCKm':
    case 'lapseRate850to500CKm':
    case 'lapseRate700to500CKm':
      return `${formatNumber(value, 1)}\u202f°C/km`;
    case 'criticalAngleDeg':
      return `${formatNumber(value, 0)}\u202f°`;
    case 'surfaceMixingRatioGkg':
      return `${formatNumber(value, 1)}\u202fg/kg`;
    case 'precipitableWaterMm':
      return `${formatNumber(value, 0)}\u202fmm`;
    case 'srh0to1km':
    case 'srh0to500m':
      return `${formatNumber(value, 0)}\u202fm²/s²`;
    case 'stp':
    case 'scp':
      return formatNumber(value, 1);
  }
}
