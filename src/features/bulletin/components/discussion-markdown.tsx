import Markdown from 'react-markdown';
import rehypeSanitize from 'rehype-sanitize';

/**
 * The Markdown renderer of the discussion, in its own chunk (loaded only where a discussion is
 * shown). Raw HTML is not rendered and the result is sanitised, so a discussion can never inject
 * markup into a public page.
 */
export function DiscussionMarkdown({ markdown }: { markdown: string }) {
  return <Markdown rehypePlugins={[rehypeSanitize]}>{markdown}</Markdown>;
}
