import { Feed } from 'feed';

export interface AtomEntry {
  number: string;
  day: number;
  state: string;
  headline: string;
  validFrom: string;
  validUntil: string;
  publishedAt: string;
  /** Said first in the entry's summary (e.g. a withdrawal). */
  notice?: string;
}

/** The Atom feed (RFC 4287) of an office's current issuances, each linking to its permanent page. */
export function buildAtomFeed(input: { officeName: string; publicUrl: string; caution: string; entries: AtomEntry[]; updated: Date }): string {
  const feed = new Feed({
    id: `${input.publicUrl}/archive`,
    title: `${input.officeName}: severe-thunderstorm outlooks`,
    description: input.caution,
    link: `${input.publicUrl}/bulletin`,
    feedLinks: { atom: `${input.publicUrl}/api/public/feed.atom` },
    updated: input.updated,
    copyright: `${input.officeName}. ${input.caution}`,
    generator: 'Stormdraft',
  });
  for (const entry of input.entries) {
    const url = `${input.publicUrl}/issuances/${entry.number}`;
    feed.addItem({
      id: url,
      link: url,
      title: `Day ${entry.day} outlook ${entry.number}${entry.state === 'published' ? '' : ` (${entry.state})`}: ${entry.headline || 'no headline'}`,
      date: new Date(entry.publishedAt),
      description: `${entry.notice ? `${entry.notice} ` : ''}Valid ${entry.validFrom} to ${entry.validUntil} (UTC). ${input.caution}`,
    });
  }
  return feed.atom1();
}
