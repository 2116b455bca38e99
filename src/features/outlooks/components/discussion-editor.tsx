import { useId, useState } from 'react';
import Markdown from 'react-markdown';
import rehypeSanitize from 'rehype-sanitize';
import { TextField, inputClasses } from '../../../components/ui/field';
import { hazardKinds, hazardLabels, type HazardKind } from '../../../../shared/contracts/outlooks';

interface DiscussionEditorProps {
  headline: string;
  discussion: string;
  hazardNotes: Partial<Record<HazardKind, string>>;
  readOnly: boolean;
  onHeadline: (value: string) => void;
  onDiscussion: (value: string) => void;
  onHazardNote: (hazard: HazardKind, value: string) => void;
}

/** Markdown rendered with raw HTML stripped and the result sanitised (rehype-sanitize's safe default schema). */
export function DiscussionPreview({ markdown }: { markdown: string }) {
  if (markdown.trim() === '') return <p className="text-[13px] text-ink-faint">Nothing written yet.</p>;
  return (
    <div className="discussion-prose space-y-2 text-sm leading-relaxed [&_h1]:text-base [&_h1]:font-semibold [&_h2]:text-sm [&_h2]:font-semibold [&_h3]:font-semibold [&_ol]:list-decimal [&_ol]:pl-5 [&_ul]:list-disc [&_ul]:pl-5 [&_a]:text-accent [&_a]:underline [&_code]:rounded [&_code]:bg-sunken [&_code]:px-1">
      <Markdown rehypePlugins={[rehypeSanitize]}>{markdown}</Markdown>
    </div>
  );
}

/** Headline, the discussion in markdown with a sanitised preview, and optional notes per hazard. */
export function DiscussionEditor({ headline, discussion, hazardNotes, readOnly, onHeadline, onDiscussion, onHazardNote }: DiscussionEditorProps) {
  const id = useId();
  const [view, setView] = useState<'write' | 'preview'>('write');
  return (
    <div className="space-y-4">
      <TextField label="Headline" value={headline} maxLength={200} disabled={readOnly} onChange={(event) => onHeadline(event.target.value)} placeholder="One line that says what matters" />
      <div>
        <div className="mb-1 flex items-center justify-between">
          <label htmlFor={`${id}-discussion`} className="text-[13px] font-medium">
            Discussion <span className="font-normal text-ink-faint">(markdown)</span>
          </label>
          <div role="group" aria-label="Discussion view" className="flex gap-1 text-[12px] lg:hidden">
            <button type="button" aria-pressed={view === 'write'} className="rounded px-2 py-0.5 aria-pressed:bg-ink aria-pressed:text-white" onClick={() => setView('write')}>
              Write
            </button>
            <button type="button" aria-pressed={view === 'preview'} className="rounded px-2 py-0.5 aria-pressed:bg-ink aria-pressed:text-white" onClick={() => setView('preview')}>
              Preview
            </button>
          </div>
        </div>
        <div className="grid gap-3 lg:grid-cols-2">
          <textarea
            id={`${id}-discussion`}
            className={`${inputClasses} min-h-56 font-mono text-[13px] ${view === 'preview' ? 'hidden lg:block' : ''}`}
            value={discussion}
            disabled={readOnly}
            maxLength={20_000}
            onChange={(event) => onDiscussion(event.target.value)}
          />
          <section aria-label="Discussion preview" className={`min-h-56 rounded-md border border-line bg-panel px-3 py-2 ${view === 'write' ? 'hidden lg:block' : ''}`}>
            <DiscussionPreview markdown={discussion} />
          </section>
        </div>
      </div>
      <fieldset>
        <legend className="mb-1 text-[13px] font-semibold">Hazard notes (optional)</legend>
        <div className="grid gap-3 md:grid-cols-2">
          {hazardKinds.map((kind) => (
            <TextField key={kind} label={hazardLabels[kind]} value={hazardNotes[kind] ?? ''} maxLength={2000} disabled={readOnly} onChange={(event) => onHazardNote(kind, event.target.value)} />
          ))}
        </div>
      </fieldset>
    </div>
  );
}
