import { FlaskConical } from 'lucide-react';

/** Marks a what-if (modified) sounding wherever it appears, with the name it was saved under. */
export function ModifiedBadge({ name }: { name: string }) {
  return (
    <span
      className="inline-flex max-w-full items-center gap-1 rounded bg-warning-soft px-1.5 py-0.5 text-[12px] font-semibold text-warning ring-1 ring-warning-line ring-inset"
      title={`Modified sounding: ${name}`}
    >
      <FlaskConical aria-hidden className="size-3 shrink-0" />
      <span className="truncate">Modified · {name}</span>
    </span>
  );
}
