/**
 * Invented storm reports for the demo office's past demo days, so verification has something
 * honest to show: clusters around the demo soundings with the highest supercell composite
 * parameter at 18 UTC (along the warm front and in the moist tongue, mostly inside the Level 2
 * and Level 3 areas), spread through the afternoon and evening, a few flooding reports in the
 * southern lowlands, and a few reports far from the instability and outside every risk area.
 * Nothing here is observed.
 */
import { analyzeSounding } from '../../shared/sounding/analyze';
import { validateSounding } from '../../shared/sounding/validate';
import type { StormReport } from '../../shared/reports/storm-report';
import { generateDemoSoundings, seededRandom } from './demo-soundings';

const remarks: Record<StormReport['hazard'], [string, ...string[]]> = {
  hail: ['Hail covering the road', 'Hail dented car roofs', 'Hail with heavy rain', 'Stones bouncing off the porch'],
  wind: ['Large limbs down', 'Trees uprooted along the county road', 'Shed roof blown off', 'Power lines down'],
  tornado: ['Brief touchdown in open fields', 'Barn destroyed, trees snapped', 'Rotating wall cloud with debris'],
  flood: ['Water over the low-water crossing', 'Creek out of its banks'],
};

/** The demo reports for `day` (UTC date): deterministic, the same on every machine. */
export function generateDemoReports(day: Date): StormReport[] {
  const soundings = generateDemoSoundings(day).filter((s) => s.metadata.validTime.endsWith('T18:00:00.000Z') || s.metadata.validTime.endsWith('T18:00:00Z'));
  const ranked = soundings
    .map((s) => {
      const parsed = validateSounding(s);
      const scp = parsed.ok ? (analyzeSounding(parsed.value.levels, { latitude: s.metadata.latitude }).composites.supercellComposite ?? 0) : 0;
      return { latitude: s.metadata.latitude, longitude: s.metadata.longitude, scp };
    })
    .sort((a, b) => b.scp - a.scp)
    .slice(0, 4);
  // A different draw each day (same invented fields), the same on every machine.
  const random = seededRandom(20270418 + day.getUTCDate());
  const base = Date.UTC(day.getUTCFullYear(), day.getUTCMonth(), day.getUTCDate(), 19);
  const reports: StormReport[] = [];
  const at = (offsetHours: number) => new Date(base + offsetHours * 3_600_000).toISOString();
  const pick = <T>(list: readonly [T, ...T[]]): T => list[Math.floor(random() * list.length)] ?? list[0];
  ranked.forEach((centre, clusterIndex) => {
    const count = 9 - clusterIndex; // more reports where it was most unstable
    for (let i = 0; i < count; i++) {
      const roll = random();
      const hazard: StormReport['hazard'] = roll < 0.45 ? 'hail' : roll < 0.85 ? 'wind' : roll < 0.95 ? 'tornado' : 'flood';
      const sig = random() < 0.25;
      reports.push({
        time: at(clusterIndex * 1.2 + i * 0.35 + random() * 0.3),
        latitude: Math.round(Math.min(41.4, Math.max(35.6, centre.latitude + (random() - 0.5) * 0.9)) * 1000) / 1000,
        longitude: Math.round(Math.min(-87.6, Math.max(-96.4, centre.longitude + (random() - 0.5) * 1.1)) * 1000) / 1000,
        hazard,
        hailCm: hazard === 'hail' ? (sig ? 5 + Math.round(random() * 20) / 10 : 2 + Math.round(random() * 25) / 10) : null,
        gustKmh: hazard === 'wind' ? (sig ? 120 + Math.round(random() * 20) : 90 + Math.round(random() * 25)) : null,
        gustMeasured: hazard === 'wind' ? random() < 0.3 : null,
        efRating: hazard === 'tornado' ? (sig ? 2 : Math.round(random())) : null,
        source: pick(['spotter', 'emergency_manager', 'public', 'measured'] as const),
        remark: pick(remarks[hazard]),
      });
    }
  });
  // Slow storms over the deep moisture of the southern lowlands: a few flooding reports.
  const floods: [number, number][] = [
    [36.1, -89.9],
    [36.5, -89.2],
    [36.3, -88.6],
  ];
  floods.forEach(([latitude, longitude], i) => {
    reports.push({ time: at(4 + i * 0.8), latitude, longitude, hazard: 'flood', hailCm: null, gustKmh: null, gustMeasured: null, efRating: null, source: 'emergency_manager', remark: pick(remarks.flood) });
  });
  // A few reports far from the instability, outside every demo risk area: honest misses.
  const outliers: [number, number, StormReport['hazard']][] = [
    [41.2, -96.2, 'wind'],
    [41.1, -95.9, 'hail'],
    [35.8, -96.1, 'wind'],
  ];
  outliers.forEach(([latitude, longitude, hazard], i) => {
    reports.push({ time: at(2 + i), latitude, longitude, hazard, hailCm: hazard === 'hail' ? 2.5 : null, gustKmh: hazard === 'wind' ? 95 : null, gustMeasured: hazard === 'wind' ? false : null, efRating: null, source: 'public', remark: 'Isolated storm outside the main activity' });
  });
  return reports;
}
