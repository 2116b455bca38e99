import type { ParcelResult, SoundingAnalysis } from '../../../../shared/sounding';

/** The parcels the diagram can show. */
export type ParcelKey = 'surfaceBased' | 'mixedLayer' | 'mostUnstable' | 'chosen';

export const STANDARD_PARCELS = ['surfaceBased', 'mixedLayer', 'mostUnstable'] as const;

export const PARCEL_LABELS: Record<ParcelKey, { long: string; short: string }> = {
  surfaceBased: { long: 'Surface-based', short: 'SB' },
  mixedLayer: { long: 'Mixed-layer (100 hPa)', short: 'ML' },
  mostUnstable: { long: 'Most unstable', short: 'MU' },
  chosen: { long: 'Chosen level', short: 'LV' },
};

/** The parcel of a key; null for 'chosen' when no level is chosen. */
export function parcelOf(analysis: SoundingAnalysis, chosen: ParcelResult | null | undefined, key: ParcelKey): ParcelResult | null {
  switch (key) {
    case 'surfaceBased':
      return analysis.surfaceBased;
    case 'mixedLayer':
      return analysis.mixedLayer;
    case 'mostUnstable':
      return analysis.mostUnstable;
    case 'chosen':
      return chosen ?? null;
  }
}
