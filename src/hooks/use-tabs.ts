import { useId, useRef, type KeyboardEvent } from 'react';

/** Props for one tab button: spread them onto a `<button>`. */
export interface TabProps {
  id: string;
  role: 'tab';
  type: 'button';
  'aria-selected': boolean;
  'aria-controls': string;
  tabIndex: 0 | -1;
  ref: (element: HTMLButtonElement | null) => void;
  onClick: () => void;
  onKeyDown: (event: KeyboardEvent<HTMLButtonElement>) => void;
}

/** Props for the one panel that shows the selected tab's content. */
export interface TabPanelProps {
  id: string;
  role: 'tabpanel';
  'aria-labelledby': string;
  tabIndex: 0;
}

/**
 * The WAI-ARIA tab pattern for a row of tabs over one panel: the selected tab is the only one in
 * the Tab order (roving tabindex); Left and Right arrows move to the previous and next tab (wrapping),
 * Home and End to the first and last, and each move selects the tab it lands on (automatic
 * activation). The panel is labelled by the selected tab. Put `role="tablist"` and a label on
 * the element that holds the tabs.
 */
export function useTabs<K extends string>(keys: readonly K[], selected: K, onSelect: (key: K) => void): { tabProps: (key: K) => TabProps; panelProps: TabPanelProps } {
  const prefix = useId();
  const buttons = useRef(new Map<K, HTMLButtonElement>());
  const tabId = (key: K) => `${prefix}tab-${key}`;
  const panelId = `${prefix}panel`;

  function move(from: K, key: string): K | null {
    const at = keys.indexOf(from);
    const last = keys.length - 1;
    const to = key === 'ArrowRight' ? (at === last ? 0 : at + 1) : key === 'ArrowLeft' ? (at === 0 ? last : at - 1) : key === 'Home' ? 0 : key === 'End' ? last : null;
    return to === null ? null : (keys[to] ?? null);
  }

  return {
    tabProps: (key) => ({
      id: tabId(key),
      role: 'tab',
      type: 'button',
      'aria-selected': key === selected,
      'aria-controls': panelId,
      tabIndex: key === selected ? 0 : -1,
      ref: (element) => {
        if (element) buttons.current.set(key, element);
        else buttons.current.delete(key);
      },
      onClick: () => onSelect(key),
      onKeyDown: (event) => {
        const next = move(key, event.key);
        if (next === null) return;
        event.preventDefault();
        onSelect(next);
        buttons.current.get(next)?.focus();
      },
    }),
    panelProps: { id: panelId, role: 'tabpanel', 'aria-labelledby': tabId(selected), tabIndex: 0 },
  };
}
