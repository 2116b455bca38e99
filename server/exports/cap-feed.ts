import { create } from 'xmlbuilder2';

export interface CapFeedEntry {
  identifier: string;
  title: string;
  capUrl: string;
  pageUrl: string;
  sent: Date;
  validUntil: Date;
}

/**
 * An Atom (RFC 4287) index of the CAP messages in force, each entry linking to its CAP 1.2 XML
 * (`application/cap+xml`), as alert aggregators read such indexes. The caution is the subtitle,
 * the rights line and part of every summary.
 */
export function buildCapFeed(input: { officeName: string; feedUrl: string; pageUrl: string; caution: string; updated: Date; entries: CapFeedEntry[] }): string {
  const doc = create({ version: '1.0', encoding: 'UTF-8' });
  const feed = doc.ele('http://www.w3.org/2005/Atom', 'feed');
  feed.ele('id').txt(input.feedUrl);
  feed.ele('title').txt(`${input.officeName}: CAP messages in force`);
  feed.ele('subtitle').txt(input.caution);
  feed.ele('updated').txt(input.updated.toISOString());
  feed.ele('author').ele('name').txt(input.officeName);
  feed.ele('rights').txt(`${input.officeName}. ${input.caution}`);
  feed.ele('generator').txt('Stormdraft');
  feed.ele('link', { rel: 'self', type: 'application/atom+xml', href: input.feedUrl });
  feed.ele('link', { rel: 'alternate', type: 'text/html', href: input.pageUrl });
  for (const entry of input.entries) {
    const item = feed.ele('entry');
    item.ele('id').txt(entry.capUrl);
    item.ele('title').txt(entry.title);
    item.ele('updated').txt(entry.sent.toISOString());
    item.ele('link', { rel: 'alternate', type: 'application/cap+xml', href: entry.capUrl });
    item.ele('link', { rel: 'related', type: 'text/html', href: entry.pageUrl });
    item.ele('summary').txt(`CAP message ${entry.identifier}, in force until ${entry.validUntil.toISOString()}. ${input.caution}`);
  }
  return doc.end({ prettyPrint: true });
}
