import type { Units } from '../../../../shared/contracts/users';
import type { ParcelResult } from '../../../../shared/sounding';
import { formatNumber, heightUnitLabel, toDisplayHeight } from './format';

/**
 * How a what-if parcel differs from the original, in numbers and in words, e.g.
 * "CAPE +850 J/kg · CIN −60 → −5 J/kg · LCL +310 m".
 * CAPE and the LCL and LFC heights as signed changes; CIN as "from → to" because its sign
 * already means something. Changes that round to zero are left out.
 */
export interface DeltaDescription {
  /** Compact numbers, joined with " · "; "no change" when nothing changed. */
  text: string;
  /** The same as a sentence for screen readers and the title. */
  sentence: string;
  changed: boolean;
}

type Compared = Pick<ParcelResult, 'cape' | 'cin' | 'lclHeight' | 'lfcHeight'>;

const SPACE = '\u202f';
const signed = (value: number, decimals: number): string => {
  const text = formatNumber(value, decimals);
  return value > 0 && Number(text) !== 0 ? `+${text}` : text;
};

export function describeDeltas(original: Compared, modified: Compared, units: Units): DeltaDescription {
  const numbers: string[] = [];
  const words: string[] = [];
  const heightUnit = heightUnitLabel[units.height];

  const capeChange = Math.round(modified.cape) - Math.round(original.cape);
  if (capeChange !== 0) {
    numbers.push(`CAPE ${signed(capeChange, 0)}${SPACE}J/kg`);
    words.push(`CAPE ${capeChange > 0 ? 'rises' : 'falls'} by ${Math.abs(capeChange)} J/kg`);
  }

  const cinBefore = Math.round(original.cin);
  const cinAfter = Math.round(modified.cin);
  if (cinBefore !== cinAfter) {
    numbers.push(`CIN ${formatNumber(cinBefore, 0)} → ${formatNumber(cinAfter, 0)}${SPACE}J/kg`);
    words.push(`CIN ${cinAfter > cinBefore ? 'weakens' : 'strengthens'} from ${formatNumber(cinBefore, 0)} to ${formatNumber(cinAfter, 0)} J/kg`);
  }

  const heightChange = (label: string, before: number | null, after: number | null, missing: string): void => {
    if (before === null && after === null) return;
    if (before === null || after === null) {
      const present = before === null ? after : before;
      const where = `${formatNumber(toDisplayHeight(present as number, units.height), 0)}${SPACE}${heightUnit}`;
      numbers.push(before === null ? `${label} now at ${where}` : `no ${label} (was ${where})`);
      words.push(before === null ? `an ${label} now exists at ${where}` : `the ${label} no longer exists (${missing})`);
      return;
    }
    const change = Math.round(toDisplayHeight(after, units.height)) - Math.round(toDisplayHeight(before, units.height));
    if (change === 0) return;
    numbers.push(`${label} ${signed(change, 0)}${SPACE}${heightUnit}`);
    words.push(`${label} ${change > 0 ? 'rises' : 'lowers'} by ${Math.abs(change)} ${heightUnit}`);
  };
  heightChange('LCL', original.lclHeight, modified.lclHeight, 'above the top of the data');
  heightChange('LFC', original.lfcHeight, modified.lfcHeight, 'the parcel never becomes buoyant');

  if (numbers.length === 0) return { text: 'no change', sentence: 'No change from the original.', changed: false };
  const sentence = words.join('; ');
  return {
    text: numbers.join(' · '),
    sentence: `${sentence.charAt(0).toUpperCase()}${sentence.slice(1)}.`,
    changed: true,
  };
}
