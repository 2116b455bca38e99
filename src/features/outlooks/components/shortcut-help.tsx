import { X } from 'lucide-react';
import { shortcutList } from './workspace-toolbar';

/** The keyboard shortcuts, as a panel over the map (toggle with ?). */
export function ShortcutHelp({ onClose }: { onClose: () => void }) {
  return (
    <section role="dialog" aria-label="Keyboard shortcuts" className="absolute top-3 right-3 z-[1000] w-80 rounded-lg border border-line bg-panel p-3 shadow-lg">
      <div className="mb-2 flex items-center justify-between">
        <h2 className="text-sm font-semibold">Keyboard shortcuts</h2>
        <button type="button" onClick={onClose} aria-label="Close shortcuts" className="rounded p-1 hover:bg-sunken">
          <X aria-hidden className="size-4" />
        </button>
      </div>
      <p className="mb-2 text-[12px] text-ink-muted">Single keys work while the map has focus (click the map or move to it with Tab). Ctrl shortcuts work anywhere.</p>
      <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 text-[13px]">
        {shortcutList.map((s) => (
          <div key={s.keys} className="contents">
            <dt>
              <kbd className="rounded border border-line-strong bg-sunken px-1 font-mono text-[12px]">{s.keys}</kbd>
            </dt>
            <dd className="text-ink-muted">{s.action}</dd>
          </div>
        ))}
      </dl>
    </section>
  );
}
