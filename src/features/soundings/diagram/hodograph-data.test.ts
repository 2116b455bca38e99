import { describe, expect, it } from 'vitest';
import type { SoundingLevel } from '../../../../shared/sounding';
import { hodographRings, hodographSegments } from './hodograph-data';

// Invented winds: u grows 1 m/s per 500 m, v = 0; band edges are interpolated linearly in height.
const levels: SoundingLevel[] = Array.from({ length: 25 }, (_, i) => ({
  pressureHpa: 1000 - i * 35,
  heightM: 300 + i * 500,
  temperatureC: 20 - i * 3,
  dewpointC: null,
  uMs: i,
  vMs: 0,
}));

describe('hodographSegments', () => {
  it('splits the 0–10 km winds into four bands that join at 1, 3 and 6 km AGL', () => {
    const segments = hodographSegments(levels);
    expect(segments.map((s) => s.band.label)).toEqual(['0–1 km', '1–3 km', '3–6 km', '6–10 km']);
    expect(segments[0]?.points.at(-1)).toEqual({ heightM: 1000, u: 2, v: 0 });
    expect(segments[1]?.points[0]).toEqual({ heightM: 1000, u: 2, v: 0 });
    expect(segments[3]?.points.at(-1)).toEqual({ heightM: 10000, u: 20, v: 0 });
  });

  it('leaves out bands the winds do not reach', () => {
    expect(hodographSegments(levels.slice(0, 5)).map((s) => s.band.label)).toEqual(['0–1 km', '1–3 km']);
  });
});

describe('hodographRings', () => {
  it('rings every 10 for 45 (in the display unit), five of them', () => {
    expect(hodographRings(45)).toEqual({ step: 10, count: 5 });
  });
});
