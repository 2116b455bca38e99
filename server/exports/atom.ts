import { create } from 'xmlbuilder2';

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

/**
 * The Atom feed (RFC 4287) of an office's issuances, newest first, each linking to its
 * permanent page. Every text construct is `type="text"` (RFC 4287 §3.1.1.1) and escaped by the
 * XML writer, so a headline is never read as HTML by a feed reader.
 */
export function buildAtomFeed(input: { officeName: string; publicUrl: string; caution: string; entries: AtomEntry[]; updated: Date }): string {
  const feed = create({ version: '1.0', encoding: 'utf-8' }).ele('feed', { xmlns: 'http://www.w3.org/2005/Atom' });
  feed.ele('id').txt(`${input.publicUrl}/archive`);
  feed.ele('title', { type: 'text' }).txt(`${input.officeName}: severe-thunderstorm outlooks`);
  feed.ele('subtitle', { type: 'text' }).txt(input.caution);
  feed.ele('updated').txt(input.updated.toISOString());
  feed.ele('generator').txt('Stormdraft');
  feed.ele('link', { rel: 'alternate', href: `${input.publicUrl}/bulletin` });
  feed.ele('link', { rel: 'self', href: `${input.publicUrl}/api/public/feed.atom` });
  feed.ele('rights', { type: 'text' }).txt(`${input.officeName}. ${input.caution}`);
  for (const entry of input.entries) {
    const url = `${input.publicUrl}/issuances/${entry.number}`;
    const item = feed.ele('entry');
    item.ele('title', { type: 'text' }).txt(`Day ${entry.day} outlook ${entry.number}${entry.state === 'published' ? '' : ` (${entry.state})`}: ${entry.headline || 'no headline'}`);
    item.ele('id').txt(url);
    item.ele('link', { href: url });
    item.ele('updated').txt(new Date(entry.publishedAt).toISOString());
    item.ele('summary', { type: 'text' }).txt(`${entry.notice ? `${entry.notice} ` : ''}Valid ${entry.validFrom} to ${entry.validUntil} (UTC). ${input.caution}`);
  }
  return feed.end({ prettyPrint: true });
}
