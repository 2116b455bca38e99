/**
 * Colours of the sounding views (the product palette). The three profile colours are the
 * same as the `--color-sounding-*` tokens in src/index.css; they are repeated here as values so
 * the SVG also renders outside the app stylesheet (static export, e-mail images).
 */
export const SOUNDING_PALETTE = {
  background: '#fcfaf6',
  frame: '#9a9186',
  isobar: '#d6cfc6',
  isotherm: '#dccbb8',
  isothermZero: '#c7b29b',
  dryAdiabat: '#c8a27f',
  pseudoAdiabat: '#7fa395',
  mixingRatio: '#8fa3bd',
  label: '#6f665c',
  temperature: '#e0481b',
  dewpoint: '#0d8a88',
  parcel: '#2a2e35',
  positiveArea: '#f08a4b',
  negativeArea: '#5b8fd6',
  cursor: '#3a50ad',
  barb: '#3b3f46',
} as const;

/** Hodograph height bands (AGL), each with its own colour; labelled in the legend, never colour alone. */
export const HODOGRAPH_BANDS = [
  { fromM: 0, toM: 1000, label: '0–1 km', colour: '#b0306a' },
  { fromM: 1000, toM: 3000, label: '1–3 km', colour: '#d0861b' },
  { fromM: 3000, toM: 6000, label: '3–6 km', colour: '#2f8059' },
  { fromM: 6000, toM: 10000, label: '6–10 km', colour: '#4058b5' },
] as const;

/** Dash patterns of the background lines (dry dashed, moist dotted, mixing ratio short-dashed). */
export const DASHES = {
  dryAdiabat: '7 4',
  pseudoAdiabat: '1.2 3',
  mixingRatio: '3 2.5',
  otherParcel: '5 3',
} as const;
