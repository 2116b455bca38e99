import { Download, Rss } from 'lucide-react';
import { feedHref, issuanceDownloads } from '../utils/issuance-format';

/** Open-format exports of one issuance, plus the feed of all issuances. */
export function IssuanceDownloads({ issuanceNumber }: { issuanceNumber: string }) {
  return (
    <section aria-labelledby={`downloads-${issuanceNumber}`}>
      <h3 id={`downloads-${issuanceNumber}`} className="text-[13px] font-semibold text-ink">
        Downloads
      </h3>
      <ul className="mt-1.5 flex flex-wrap gap-x-4 gap-y-1 text-sm">
        {issuanceDownloads(issuanceNumber).map((download) => (
          <li key={download.href}>
            <a href={download.href} download className="inline-flex items-center gap-1 text-accent hover:underline">
              <Download aria-hidden className="size-3.5" />
              {download.label}
              <span className="sr-only"> of issuance {issuanceNumber}</span>
            </a>
          </li>
        ))}
        <li>
          <a href={feedHref} className="inline-flex items-center gap-1 text-accent hover:underline">
            <Rss aria-hidden className="size-3.5" />
            Atom feed of outlooks in force
          </a>
        </li>
      </ul>
    </section>
  );
}
