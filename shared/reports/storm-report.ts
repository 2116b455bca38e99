/** Storm reports: point events used to verify outlooks. */

export const reportHazards = ['tornado', 'hail', 'wind', 'flood'] as const;
export type ReportHazard = (typeof reportHazards)[number];

export const reportSources = ['spotter', 'emergency_manager', 'public', 'measured'] as const;
export type ReportSource = (typeof reportSources)[number];

export const reportHazardLabels: Record<ReportHazard, string> = {
  tornado: 'Tornado',
  hail: 'Hail',
  wind: 'Damaging wind',
  flood: 'Flash flood',
};

export const reportSourceLabels: Record<ReportSource, string> = {
  spotter: 'Spotter',
  emergency_manager: 'Emergency manager',
  public: 'Public',
  measured: 'Measured',
};

/** A storm report as stored and exchanged (JSON in camelCase; magnitudes in cm, km/h, EF number). */
export interface StormReport {
  time: string;
  latitude: number;
  longitude: number;
  hazard: ReportHazard;
  /** hail diameter in centimetres */
  hailCm: number | null;
  /** wind gust in km/h */
  gustKmh: number | null;
  /** true when the gust was measured by an instrument, false when estimated */
  gustMeasured: boolean | null;
  /** Enhanced Fujita rating 0–5 (null: not rated or unknown) */
  efRating: number | null;
  source: ReportSource;
  remark: string;
}

/** Limits on one intake: file size, reports per file, remark length. */
export const reportLimits = {
  maxFileBytes: 2 * 1024 * 1024,
  maxReportsPerFile: 10_000,
  maxRemarkChars: 500,
  /** Plausible hail: 0.1–25 cm (the largest recorded stones are about 20 cm: common practice to allow some margin). */
  hailCm: { min: 0.1, max: 25 },
  /** Plausible gusts: 20–500 km/h (500 km/h is above any measured gust; common practice as a sanity bound). */
  gustKmh: { min: 20, max: 500 },
} as const;

/**
 * Two reports of the same hazard within this distance and time are one event: the rule our
 * duplicate merging follows (our choice, stated here and in docs/storm-reports.md).
 */
export const duplicateRule = { distanceKm: 5, minutes: 15 } as const;
