import { describe, expect, it } from 'vitest';
import { barbShape, decomposeBarb } from './wind-barb';

// Convention (WMO No. 485 plotting practice; common practice): pennant 50 kt, full barb 10 kt,
// half barb 5 kt, speeds rounded to the nearest 5 kt.
describe('decomposeBarb', () => {
  it('65 kt is 1 pennant, 1 full barb and 1 half barb', () => {
    expect(decomposeBarb(65)).toEqual({ pennants: 1, fullBarbs: 1, halfBarbs: 1, roundedKt: 65 });
  });

  it('rounds 23 kt to 25 kt: 2 full barbs and a half barb', () => {
    expect(decomposeBarb(23)).toEqual({ pennants: 0, fullBarbs: 2, halfBarbs: 1, roundedKt: 25 });
  });

  it('115 kt is 2 pennants, 1 full barb and 1 half barb', () => {
    expect(decomposeBarb(115)).toEqual({ pennants: 2, fullBarbs: 1, halfBarbs: 1, roundedKt: 115 });
  });

  it('2 kt rounds to calm', () => {
    expect(decomposeBarb(2).roundedKt).toBe(0);
  });
});

describe('barbShape', () => {
  it('points the staff toward the direction the wind comes from: a west wind extends left of the station', () => {
    const shape = barbShape({ x: 100, y: 100 }, 270, 20, 30);
    expect(shape.linePath.startsWith('M100.0,100.0L70.0,100.0')).toBe(true);
  });

  it('puts barbs on the north side of a west wind’s staff (northern-hemisphere convention)', () => {
    const shape = barbShape({ x: 100, y: 100 }, 270, 10, 30);
    const barb = shape.linePath.split('M')[2] ?? '';
    const end = barb.split('L')[1]?.split(',') ?? [];
    expect(Number(end[1])).toBeLessThan(100);
  });

  it('draws a pennant only for 50 kt or more', () => {
    expect(barbShape({ x: 0, y: 0 }, 180, 45).pennantPath).toBe('');
    expect(barbShape({ x: 0, y: 0 }, 180, 50).pennantPath).not.toBe('');
  });

  it('marks calm', () => {
    expect(barbShape({ x: 0, y: 0 }, 0, 1).calm).toBe(true);
  });
});
