import { describe, expect, it } from 'vitest';
import { validateSounding } from './validate';

const metadata = { station: 'TST', latitude: 38.4, longitude: -91.3, elevationM: 100, validTime: '2027-04-18T18:00:00Z', source: 'model' };
const levels = [
  { pressureHpa: 1000, heightM: 100, temperatureC: 28, dewpointC: 20, uMs: 1, vMs: 5 },
  { pressureHpa: 900, heightM: 1030, temperatureC: 21, dewpointC: 15, uMs: 5, vMs: 10 },
  { pressureHpa: 850, heightM: 1520, temperatureC: 18, dewpointC: 12, uMs: null, vMs: null },
  { pressureHpa: 700, heightM: 3100, temperatureC: 8, dewpointC: -2 },
  { pressureHpa: 500, heightM: 5800, temperatureC: -10, dewpointC: -25 },
  { pressureHpa: 300, heightM: 9500, temperatureC: -38, dewpointC: -50 },
];

describe('validateSounding (structured input, same checks and codes as the CSV parser)', () => {
  it('accepts a valid sounding and sorts levels given upward', () => {
    const result = validateSounding({ metadata, levels: [...levels].reverse() });
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.value.levels.map((l) => l.pressureHpa)).toEqual([1000, 900, 850, 700, 500, 300]);
    expect(result.value.levels[3]?.uMs).toBeNull();
    expect(result.value.metadata.validTime).toBe('2027-04-18T18:00:00.000Z');
  });

  it('reports a dewpoint above temperature with levelIndex and field name, and clips it', () => {
    const bad = levels.map((l, i) => (i === 2 ? { ...l, dewpointC: 25 } : l));
    const result = validateSounding({ metadata, levels: bad });
    const value = result.ok ? result.value : undefined;
    expect(value?.warnings[0]).toMatchObject({ code: 'DEWPOINT_ABOVE_TEMPERATURE', levelIndex: 2, column: 'dewpointC' });
    expect(value?.warnings[0]?.message).toMatch(/^sounding, levels\[2\]\.dewpointC/);
    expect(value?.levels[2]?.dewpointC).toBe(value?.levels[2]?.temperatureC);
  });

  it('reports a value that is not a number as NOT_A_NUMBER', () => {
    const bad = levels.map((l, i) => (i === 1 ? { ...l, temperatureC: '21' } : l));
    const result = validateSounding({ metadata, levels: bad });
    expect(!result.ok && result.error[0]).toMatchObject({ code: 'NOT_A_NUMBER', levelIndex: 1, column: 'temperatureC' });
  });

  it('reports missing metadata as a warning with the field name', () => {
    const result = validateSounding({ metadata: { ...metadata, validTime: undefined }, levels });
    expect(result.ok && result.value.warnings.find((e) => e.code === 'MISSING_METADATA')?.column).toBe('metadata.validTime');
  });

  it('rejects input that is not a sounding object (INVALID_INPUT)', () => {
    for (const input of [null, 42, 'text', { levels: 'no' }]) {
      const result = validateSounding(input);
      expect(!result.ok && result.error[0]?.code).toBe('INVALID_INPUT');
    }
  });

  it('sorts a mixed level order (LEVELS_SORTED warning)', () => {
    const shuffled = [levels[0], levels[2], levels[1], levels[3], levels[4], levels[5]];
    const result = validateSounding({ metadata, levels: shuffled });
    expect(result.ok && result.value.warnings.map((w) => w.code)).toContain('LEVELS_SORTED');
    expect(result.ok && result.value.levels.map((l) => l.pressureHpa)).toEqual([...levels].map((l) => l?.pressureHpa).sort((a, b) => (b ?? 0) - (a ?? 0)));
  });
});
