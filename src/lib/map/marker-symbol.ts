import type { MarkerShape } from './risk-area-types';

const paths: Record<MarkerShape, string> = {
  'triangle-down': 'M2 3 L14 3 L8 14 Z',
  circle: 'M8 2.5 A5.5 5.5 0 1 1 7.99 2.5 Z',
  square: 'M3 3 H13 V13 H3 Z',
  diamond: 'M8 1.5 L14.5 8 L8 14.5 L1.5 8 Z',
};

/**
 * A 16-pixel SVG of a point symbol: a dark outline that reads on every risk-level fill, filled
 * dark for significant events. Used as the map marker and in the legend, so they always match.
 */
export function markerSvg(shape: MarkerShape, filled: boolean): string {
  return `<svg xmlns="http://www.w3.org/2000/svg" width="16" height="16" viewBox="0 0 16 16" aria-hidden="true"><path d="${paths[shape]}" fill="${filled ? '#101624' : '#ffffff'}" stroke="#101624" stroke-width="1.6" stroke-linejoin="round"/></svg>`;
}
