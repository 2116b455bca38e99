import { TriangleAlert } from 'lucide-react';
import { z } from 'zod';

const flagsSchema = z.object({ flags: z.array(z.object({ code: z.string(), message: z.string() })) });

/** The quality flags of a stored analysis (empty when it has none or is from an older engine). */
export function qualityFlagsOf(analysis: unknown): { code: string; message: string }[] {
  const parsed = flagsSchema.safeParse(analysis);
  return parsed.success ? parsed.data.flags : [];
}

/** Quality flags of the analysis: the sounding still counts as evidence, but these numbers need care. */
export function SoundingFlags({ analysis }: { analysis: unknown }) {
  const flags = qualityFlagsOf(analysis);
  if (flags.length === 0) return null;
  return (
    <section aria-labelledby="sounding-flags-title" className="mb-4 rounded-md border border-warning-line border-l-4 bg-warning-soft px-3.5 py-2.5 text-sm">
      <h2 id="sounding-flags-title" className="flex items-center gap-2 font-semibold text-ink">
        <TriangleAlert aria-hidden className="size-4 text-warning" />
        {flags.length === 1 ? '1 quality flag' : `${flags.length} quality flags`}
      </h2>
      <ul className="mt-1 list-disc space-y-0.5 pl-10 text-[13px] text-ink-muted">
        {flags.map((flag, index) => (
          <li key={index}>
            <span className="font-medium text-ink">{flag.code}: </span>
            {flag.message}
          </li>
        ))}
      </ul>
    </section>
  );
}
