import { fromMarkdown } from 'mdast-util-from-markdown';
import { toString } from 'mdast-util-to-string';

/** Longest excerpt, in characters (an e-mail teaser, not the discussion). */
export const MARKDOWN_EXCERPT_MAX_CHARACTERS = 400;

/**
 * The first paragraph of a Markdown text as plain text, for e-mail: parsed by the CommonMark
 * parser (mdast), so headings, emphasis, code, links and lists come out as their words, not
 * their marks. Cut at a word boundary with an ellipsis when longer than the limit.
 */
export function markdownExcerpt(markdown: string, maxCharacters = MARKDOWN_EXCERPT_MAX_CHARACTERS): string {
  const tree = fromMarkdown(markdown);
  const first = tree.children.find((node) => node.type === 'paragraph' && toString(node).trim() !== '');
  const text = first ? toString(first).replace(/\s+/g, ' ').trim() : '';
  if (text.length <= maxCharacters) return text;
  const cut = text.slice(0, maxCharacters - 1);
  const lastSpace = cut.lastIndexOf(' ');
  return `${(lastSpace > maxCharacters / 2 ? cut.slice(0, lastSpace) : cut).trimEnd()}…`;
}
