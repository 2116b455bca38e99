import { describe, expect, it } from 'vitest';
import { describeDeltas } from './describe-deltas';

// Inputs are invented parcels; the expected strings follow from the rules documented in
// describe-deltas.ts (signed changes for CAPE and heights, "from → to" for CIN).
const metric = { temperature: 'C', height: 'm', speed: 'kt' } as const;
const imperial = { temperature: 'F', height: 'ft', speed: 'mph' } as const;
const original = { cape: 1200, cin: -60, lclHeight: 900, lfcHeight: 1800 };

describe('describeDeltas', () => {
  it('reads "CAPE +850 J/kg · CIN −60 → −5 J/kg · LCL +310 m" for a warmer, moister parcel', () => {
    const result = describeDeltas(original, { cape: 2050, cin: -5, lclHeight: 1210, lfcHeight: 1800 }, metric);
    expect(result.text).toBe('CAPE +850\u202fJ/kg · CIN \u221260 → \u22125\u202fJ/kg · LCL +310\u202fm');
    expect(result.sentence).toBe('CAPE rises by 850 J/kg; CIN weakens from \u221260 to \u22125 J/kg; LCL rises by 310 m.');
    expect(result.changed).toBe(true);
  });

  it('uses a true minus sign and "falls" / "strengthens" / "lowers" for a cooler, drier parcel', () => {
    const result = describeDeltas(original, { cape: 700, cin: -120, lclHeight: 800, lfcHeight: 1500 }, metric);
    expect(result.text).toBe('CAPE \u2212500\u202fJ/kg · CIN \u221260 → \u2212120\u202fJ/kg · LCL \u2212100\u202fm · LFC \u2212300\u202fm');
    expect(result.sentence).toContain('CAPE falls by 500 J/kg');
    expect(result.sentence).toContain('CIN strengthens');
    expect(result.sentence).toContain('LCL lowers by 100 m');
  });

  it('gives heights in feet when the person chose feet (310 m = 1017 ft, 1 ft = 0.3048 m)', () => {
    const result = describeDeltas(original, { ...original, lclHeight: 1210 }, imperial);
    // 1210 m = 3969.8 ft → 3970; 900 m = 2952.8 ft → 2953; 3970 − 2953 = 1017.
    expect(result.text).toBe('LCL +1017\u202fft');
  });

  it('says when an LFC appears or disappears', () => {
    const gone = describeDeltas(original, { ...original, lfcHeight: null }, metric);
    expect(gone.text).toBe('no LFC (was 1800\u202fm)');
    expect(gone.sentence).toContain('no longer exists');
    const appears = describeDeltas({ ...original, lfcHeight: null }, original, metric);
    expect(appears.text).toBe('LFC now at 1800\u202fm');
  });

  it('says "no change" when nothing changes after rounding', () => {
    const result = describeDeltas(original, { cape: 1200.2, cin: -59.8, lclHeight: 900.3, lfcHeight: 1800 }, metric);
    expect(result).toEqual({ text: 'no change', sentence: 'No change from the original.', changed: false });
  });
});
