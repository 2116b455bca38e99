import { textColourOn } from '../../../shared/contracts/office';

/** A ladder step as a chip: always the label (never colour alone), with contrasting text. */
export function RiskSwatch({ label, colour }: { label: string; colour: string }) {
  const valid = /^#[0-9a-fA-F]{6}$/.test(colour);
  return (
    <span
      className="inline-flex min-w-28 items-center rounded px-2 py-0.5 text-[13px] font-semibold ring-1 ring-black/10 ring-inset"
      style={valid ? { backgroundColor: colour, color: textColourOn(colour) } : undefined}
      data-text-colour={valid ? textColourOn(colour) : undefined}
    >
      {label || 'Unnamed level'}
    </span>
  );
}
