import { describe, expect, it } from 'vitest';
import { gaussianWeight } from './smoothing';

describe('gaussianWeight', () => {
  it('sums to one over an unbounded grid (the kernel integrates to one)', () => {
    const sigma = 120;
    const spacing = 20;
    const reach = Math.ceil((8 * sigma) / spacing);
    let total = 0;
    for (let i = -reach; i <= reach; i++) for (let j = -reach; j <= reach; j++) total += gaussianWeight(spacing * Math.hypot(i, j), sigma, spacing);
    // A Gaussian sampled at a spacing much finer than σ sums to its integral to far better than 1e-9.
    expect(total).toBeCloseTo(1, 9);
  });

  it('peaks at the report and falls to e^-1/2 of the peak one smoothing length away (definition of σ)', () => {
    const peak = gaussianWeight(0, 120, 20);
    expect(gaussianWeight(120, 120, 20) / peak).toBeCloseTo(Math.exp(-0.5), 12);
  });
});
