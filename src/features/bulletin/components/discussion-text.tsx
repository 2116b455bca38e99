import Markdown from 'react-markdown';
import rehypeSanitize from 'rehype-sanitize';

/**
 * The forecasters' discussion, written in Markdown. Raw HTML is not rendered and the result is
 * sanitised, so a discussion can never inject markup into a public page.
 */
export function DiscussionText({ markdown }: { markdown: string }) {
  if (markdown.trim() === '') return <p className="text-sm text-ink-muted">No discussion was written for this outlook.</p>;
  return (
    <div className="space-y-2 text-sm leading-relaxed text-ink [&_a]:text-accent [&_a]:underline [&_h1]:text-base [&_h1]:font-semibold [&_h2]:text-[15px] [&_h2]:font-semibold [&_h3]:font-semibold [&_li]:ml-5 [&_ol]:list-decimal [&_ul]:list-disc">
      <Markdown rehypePlugins={[rehypeSanitize]}>{markdown}</Markdown>
    </div>
  );
}
