import { lazy, Suspense } from 'react';

const DiscussionMarkdown = lazy(async () => ({ default: (await import('./discussion-markdown')).DiscussionMarkdown }));

/** Until the Markdown renderer has loaded, the discussion reads as plain paragraphs. */
function PlainDiscussion({ markdown }: { markdown: string }) {
  return (
    <>
      {markdown
        .split(/\n\s*\n/)
        .filter((paragraph) => paragraph.trim() !== '')
        .map((paragraph, index) => (
          <p key={index} className="whitespace-pre-line">
            {paragraph}
          </p>
        ))}
    </>
  );
}

/**
 * The forecasters' discussion, written in Markdown. The renderer loads on its own, after the
 * page, so the public bulletin's first load stays light; the text is readable meanwhile.
 */
export function DiscussionText({ markdown }: { markdown: string }) {
  if (markdown.trim() === '') return <p className="text-sm text-ink-muted">No discussion was written for this outlook.</p>;
  return (
    <div className="space-y-2 text-sm leading-relaxed break-words text-ink [&_a]:text-accent [&_a]:underline [&_h1]:text-base [&_h1]:font-semibold [&_h2]:text-[15px] [&_h2]:font-semibold [&_h3]:font-semibold [&_li]:ml-5 [&_ol]:list-decimal [&_ul]:list-disc">
      <Suspense fallback={<PlainDiscussion markdown={markdown} />}>
        <DiscussionMarkdown markdown={markdown} />
      </Suspense>
    </div>
  );
}
