/**
 * How every risk area's edge is drawn on the maps. Adjacent ladder fills cannot reach 3:1
 * against each other (level 3 beside level 4 is about 1.4:1), so colour alone never marks an
 * edge: each area has a two-colour outline, a near-black line on a white casing. Any colour
 * reaches at least 3:1 against one of the two, so the edge stands out against the base map, its
 * own fill and every neighbouring level (WCAG 2.1 SC 1.4.11, non-text contrast; the two-colour
 * indicator is WCAG technique C40). Each area also keeps its text label.
 */
export const AREA_OUTLINE = {
  casing: { colour: '#ffffff', weight: 5 },
  line: { colour: '#101624', weight: 1.75 },
  selectedLine: { colour: '#101624', weight: 3, dashArray: '6 4' },
} as const;

/** How strongly the fills show over the base map (the editor keeps them lighter to see soundings). */
export const AREA_FILL_OPACITY = { editor: 0.5, readOnly: 0.72 } as const;

/** The offline base map's background (matches the map containers' `bg-[#eef1f5]`). */
export const BASE_MAP_BACKGROUND = '#eef1f5';

function channel(value: number): number {
  const c = value / 255;
  return c <= 0.03928 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
}

function rgb(hex: string): [number, number, number] {
  const h = hex.replace('#', '');
  const full = h.length === 3 ? [...h].map((c) => c + c).join('') : h;
  return [parseInt(full.slice(0, 2), 16), parseInt(full.slice(2, 4), 16), parseInt(full.slice(4, 6), 16)];
}

/** Relative luminance of an sRGB colour `#rrggbb` (WCAG 2.1, definition of relative luminance). */
export function relativeLuminance(hex: string): number {
  const [r, g, b] = rgb(hex);
  return 0.2126 * channel(r) + 0.7152 * channel(g) + 0.0722 * channel(b);
}

/** Contrast ratio (L1 + 0.05) / (L2 + 0.05) of two colours, from 1 to 21 (WCAG 2.1, contrast ratio). */
export function contrastRatio(a: string, b: string): number {
  const [light, dark] = [relativeLuminance(a), relativeLuminance(b)].sort((x, y) => y - x) as [number, number];
  return (light + 0.05) / (dark + 0.05);
}

/** The colour seen where `top` is painted with `opacity` over `bottom` (sRGB alpha compositing). */
export function blend(top: string, opacity: number, bottom: string): string {
  const t = rgb(top);
  const b = rgb(bottom);
  return `#${t.map((c, i) => Math.round(c * opacity + (b[i] ?? 0) * (1 - opacity)).toString(16).padStart(2, '0')).join('')}`;
}
