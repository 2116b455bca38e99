import { describe, expect, it } from 'vitest';
import { significantTornado, significantTornadoFixedLayer, supercellComposite, supercellCompositeFixedLayer } from './composites';

// Each expected value is the published formula evaluated by hand on round inputs.
describe('supercell composite parameter', () => {
  it('effective form: (muCAPE/1000)(ESRH/50)(EBWD/20) = 2·3·1 = 6 (Thompson2007)', () => {
    expect(supercellComposite(2000, 150, 20)).toBeCloseTo(6, 12);
  });

  it('effective form: the EBWD term is 0 below 10 m/s and 1 above 20 m/s (Thompson2007)', () => {
    expect(supercellComposite(2000, 150, 9.9)).toBe(0);
    expect(supercellComposite(2000, 150, 35)).toBeCloseTo(6, 12);
    expect(supercellComposite(2000, 150, 15)).toBeCloseTo(4.5, 12);
  });

  it('fixed-layer form: (MUCAPE/1000)(SRH3/100)(BRN shear/40) = 2·2·1 = 4 (Thompson2003)', () => {
    expect(supercellCompositeFixedLayer(2000, 200, 40)).toBeCloseTo(4, 12);
  });
});

describe('significant tornado parameter', () => {
  it('fixed-layer form equals 1 at the normalising values (Thompson2012)', () => {
    expect(significantTornadoFixedLayer(1500, 1000, 150, 20)).toBeCloseTo(1, 12);
  });

  it('fixed-layer form: LCL term 1 below 1000 m, 0 above 2000 m; BWD term 0 below 12.5, capped 1.5 above 30 m/s (Thompson2012)', () => {
    expect(significantTornadoFixedLayer(1500, 500, 150, 20)).toBeCloseTo(1, 12);
    expect(significantTornadoFixedLayer(1500, 2100, 150, 20)).toBe(0);
    expect(significantTornadoFixedLayer(1500, 1500, 150, 20)).toBeCloseTo(0.5, 12);
    expect(significantTornadoFixedLayer(1500, 1000, 150, 12)).toBe(0);
    expect(significantTornadoFixedLayer(1500, 1000, 150, 40)).toBeCloseTo(1.5, 12);
  });

  it('effective-layer form equals 1 at the normalising values and no CIN (Thompson2012)', () => {
    expect(significantTornado(1500, 1000, 150, 20, 0)).toBeCloseTo(1, 12);
  });

  it('effective-layer form: CIN term 1 above −50, 0 below −200, (200 + CIN)/150 between (Thompson2012)', () => {
    expect(significantTornado(1500, 1000, 150, 20, -40)).toBeCloseTo(1, 12);
    expect(significantTornado(1500, 1000, 150, 20, -125)).toBeCloseTo(0.5, 12);
    expect(significantTornado(1500, 1000, 150, 20, -250)).toBe(0);
  });
});
