import { describe, expect, it } from 'vitest';
import { formatBytes, formatDuration, outcomeText, progressText } from './intake-format';

describe('intake formatting', () => {
  it('when sizes and durations are shown, they read as people write them', () => {
    expect(formatBytes(1206)).toBe('1 kB');
    expect(formatBytes(2_500_000)).toBe('2.5 MB');
    expect(formatBytes(12)).toBe('12 B');
    expect(formatDuration(null)).toBe('—');
    expect(formatDuration(420)).toBe('0.4 s');
    expect(formatDuration(65_000)).toBe('1 min 05 s');
  });

  it('when a file is being taken in, its progress is shown; otherwise none', () => {
    expect(progressText({ state: 'processing', progressDone: 0, progressTotal: 0 })).toBe('Decoding…');
    expect(progressText({ state: 'processing', progressDone: 12, progressTotal: 40 })).toBe('12 of 40 soundings analysed');
    expect(progressText({ state: 'done', progressDone: 40, progressTotal: 40 })).toBeNull();
  });

  it('when a file is done, the outcome counts new and already-stored soundings', () => {
    expect(outcomeText({ state: 'done', soundingCount: 3, duplicateSoundingCount: 1, runIds: [] })).toBe('3 new · 1 already stored');
    expect(outcomeText({ state: 'duplicate', soundingCount: 0, duplicateSoundingCount: 0, runIds: [] })).toBe('Already taken in');
    expect(outcomeText({ state: 'failed', soundingCount: 0, duplicateSoundingCount: 0, runIds: [] })).toBe('—');
  });
});
