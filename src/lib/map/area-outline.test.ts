import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { defaultRiskLadder } from '../../../shared/contracts/office';
import { AREA_FILL_OPACITY, AREA_OUTLINE, BASE_MAP_BACKGROUND, blend, contrastRatio } from './area-outline';

/** The better of the outline's two colours against a surface: what makes the edge visible there. */
const edgeContrast = (surface: string) => Math.max(contrastRatio(AREA_OUTLINE.casing.colour, surface), contrastRatio(AREA_OUTLINE.line.colour, surface));

describe('contrastRatio', () => {
  it('when comparing black and white, then 21:1, and a colour with itself 1:1 (WCAG 2.1, definition of contrast ratio: ratios range from 1 to 21)', () => {
    expect(contrastRatio('#000000', '#ffffff')).toBeCloseTo(21, 6);
    expect(contrastRatio('#ffffff', '#000000')).toBeCloseTo(21, 6);
    expect(contrastRatio('#6b3aa6', '#6b3aa6')).toBeCloseTo(1, 6);
  });

  it('when comparing #767676 with white, then 4.54:1 (common practice: the lightest grey that passes 4.5:1 on white)', () => {
    expect(contrastRatio('#767676', '#ffffff')).toBeCloseTo(4.54, 2);
    expect(contrastRatio('#777777', '#ffffff')).toBeLessThan(4.5);
  });
});

describe('risk area outline (WCAG 2.1 SC 1.4.11: 3:1 against adjacent colours)', () => {
  const fills = defaultRiskLadder.map((step) => step.colour);

  it('when adjacent ladder fills meet, then they cannot mark the edge by themselves (why the outline exists)', () => {
    const level3 = defaultRiskLadder.find((s) => s.key === 'level3')?.colour ?? '';
    const level4 = defaultRiskLadder.find((s) => s.key === 'level4')?.colour ?? '';
    expect(contrastRatio(level3, level4)).toBeLessThan(3);
  });

  it.each(Object.entries(AREA_FILL_OPACITY))('when areas are filled as on the %s map, then the outline reaches 3:1 against the base map, every fill and every fill over another', (_map, opacity) => {
    const overBase = fills.map((fill) => blend(fill, opacity, BASE_MAP_BACKGROUND));
    const nested = overBase.flatMap((under) => fills.map((fill) => blend(fill, opacity, under)));
    const surfaces = [BASE_MAP_BACKGROUND, ...fills, ...overBase, ...nested];
    const weakest = Math.min(...surfaces.map(edgeContrast));
    expect(weakest).toBeGreaterThanOrEqual(3);
  });

  it('when an office recolours its ladder with any colour, then the outline still reaches 3:1 against it', () => {
    fc.assert(
      fc.property(fc.tuple(fc.integer({ min: 0, max: 255 }), fc.integer({ min: 0, max: 255 }), fc.integer({ min: 0, max: 255 })), ([r, g, b]) => {
        const colour = `#${[r, g, b].map((c) => c.toString(16).padStart(2, '0')).join('')}`;
        expect(edgeContrast(colour)).toBeGreaterThanOrEqual(3);
      }),
    );
  });

  it('when the line is drawn, then it sits inside a wider casing so both colours show', () => {
    expect(AREA_OUTLINE.casing.weight).toBeGreaterThanOrEqual(AREA_OUTLINE.line.weight + 2);
    expect(AREA_OUTLINE.casing.weight).toBeGreaterThanOrEqual(AREA_OUTLINE.selectedLine.weight + 2);
  });
});
