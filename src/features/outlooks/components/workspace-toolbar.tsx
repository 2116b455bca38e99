import { clsx } from 'clsx';
import { Hand, HelpCircle, MousePointer2, PenLine, Redo2, Scissors, Spline, Trash2, Undo2 } from 'lucide-react';
import type { ReactNode } from 'react';
import type { EditorMode } from '../../../lib/map/area-editor-map';

interface ToolbarProps {
  mode: EditorMode;
  hasSelection: boolean;
  readOnly: boolean;
  canUndo: boolean;
  canRedo: boolean;
  onMode: (mode: EditorMode) => void;
  onDelete: () => void;
  onUndo: () => void;
  onRedo: () => void;
  onHelp: () => void;
}

function ToolButton({ label, shortcut, pressed, disabled, onClick, children }: { label: string; shortcut: string; pressed?: boolean; disabled?: boolean; onClick: () => void; children: ReactNode }) {
  return (
    <button
      type="button"
      aria-pressed={pressed}
      disabled={disabled}
      onClick={onClick}
      title={`${label} (${shortcut})`}
      aria-keyshortcuts={shortcut}
      className={clsx(
        'inline-flex h-8 items-center gap-1.5 rounded-md px-2 text-[13px] font-medium disabled:cursor-not-allowed disabled:opacity-40',
        pressed ? 'bg-ink text-white' : 'text-ink hover:bg-sunken',
      )}
    >
      {children}
      <span>{label}</span>
    </button>
  );
}

/** Drawing and editing tools; each has a keyboard shortcut listed in the help panel. */
export function WorkspaceToolbar({ mode, hasSelection, readOnly, canUndo, canRedo, onMode, onDelete, onUndo, onRedo, onHelp }: ToolbarProps) {
  const icon = 'size-4';
  return (
    <div role="toolbar" aria-label="Drawing tools" className="flex flex-wrap items-center gap-0.5 rounded-lg border border-line bg-panel p-1">
      <ToolButton label="Select" shortcut="V" pressed={mode === 'select'} onClick={() => onMode('select')}>
        <MousePointer2 aria-hidden className={icon} />
      </ToolButton>
      <ToolButton label="Draw area" shortcut="N" pressed={mode === 'draw'} disabled={readOnly} onClick={() => onMode(mode === 'draw' ? 'select' : 'draw')}>
        <PenLine aria-hidden className={icon} />
      </ToolButton>
      <ToolButton label="Edit vertices" shortcut="E" pressed={mode === 'edit'} disabled={readOnly || !hasSelection} onClick={() => onMode(mode === 'edit' ? 'select' : 'edit')}>
        <Spline aria-hidden className={icon} />
      </ToolButton>
      <ToolButton label="Move" shortcut="M" pressed={mode === 'move'} disabled={readOnly || !hasSelection} onClick={() => onMode(mode === 'move' ? 'select' : 'move')}>
        <Hand aria-hidden className={icon} />
      </ToolButton>
      <ToolButton label="Cut hole" shortcut="H" pressed={mode === 'cut'} disabled={readOnly || !hasSelection} onClick={() => onMode(mode === 'cut' ? 'select' : 'cut')}>
        <Scissors aria-hidden className={icon} />
      </ToolButton>
      <ToolButton label="Delete" shortcut="Delete" disabled={readOnly || !hasSelection} onClick={onDelete}>
        <Trash2 aria-hidden className={icon} />
      </ToolButton>
      <span aria-hidden className="mx-1 h-5 w-px bg-line" />
      <ToolButton label="Undo" shortcut="Control+Z" disabled={readOnly || !canUndo} onClick={onUndo}>
        <Undo2 aria-hidden className={icon} />
      </ToolButton>
      <ToolButton label="Redo" shortcut="Control+Shift+Z" disabled={readOnly || !canRedo} onClick={onRedo}>
        <Redo2 aria-hidden className={icon} />
      </ToolButton>
      <span aria-hidden className="mx-1 h-5 w-px bg-line" />
      <ToolButton label="Shortcuts" shortcut="?" onClick={onHelp}>
        <HelpCircle aria-hidden className={icon} />
      </ToolButton>
    </div>
  );
}

/** The shortcuts, for the help panel. */
export const shortcutList: { keys: string; action: string }[] = [
  { keys: 'V or Esc', action: 'Select areas (leave the current tool)' },
  { keys: 'N', action: 'Draw a new area: click points, click the first point to finish' },
  { keys: 'E', action: 'Edit the selected area’s vertices' },
  { keys: 'M', action: 'Move the selected area' },
  { keys: 'H', action: 'Cut a hole in the selected area' },
  { keys: 'Delete', action: 'Delete the selected area' },
  { keys: '1 … 6', action: 'Set the selected area’s level (ladder order)' },
  { keys: 'Ctrl+Z', action: 'Undo' },
  { keys: 'Ctrl+Shift+Z or Ctrl+Y', action: 'Redo' },
  { keys: 'Ctrl+S', action: 'Save now' },
  { keys: '?', action: 'Show or hide this list' },
];
