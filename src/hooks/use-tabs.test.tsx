import { cleanup, fireEvent, render, screen } from '@testing-library/react';
import { useState } from 'react';
import { afterEach, describe, expect, it } from 'vitest';
import { useTabs } from './use-tabs';

afterEach(cleanup);

const keys = ['area', 'outlook', 'history'] as const;
const labels = { area: 'Selected area', outlook: 'All areas', history: 'Revisions' };

function Panel() {
  const [tab, setTab] = useState<(typeof keys)[number]>('area');
  const { tabProps, panelProps } = useTabs(keys, tab, setTab);
  return (
    <>
      <button type="button">Before</button>
      <div role="tablist" aria-label="Panel">
        {keys.map((key) => (
          <button key={key} {...tabProps(key)}>
            {labels[key]}
          </button>
        ))}
      </div>
      <div {...panelProps}>Showing {labels[tab]}</div>
    </>
  );
}

const tab = (name: string) => screen.getByRole('tab', { name });
const selectedTabs = () => screen.getAllByRole('tab').filter((t) => t.getAttribute('aria-selected') === 'true').map((t) => t.textContent);
const tabStops = () => screen.getAllByRole('tab').filter((t) => t.tabIndex === 0).map((t) => t.textContent);

describe('useTabs (WAI-ARIA tab pattern)', () => {
  it('when rendered, then only the selected tab is selected and in the Tab order, and the panel is labelled by it', () => {
    render(<Panel />);
    expect(selectedTabs()).toEqual(['Selected area']);
    expect(tabStops()).toEqual(['Selected area']);
    const panel = screen.getByRole('tabpanel');
    expect(panel.getAttribute('aria-labelledby')).toBe(tab('Selected area').id);
    expect(tab('All areas').getAttribute('aria-controls')).toBe(panel.id);
    expect(screen.getByRole('tabpanel', { name: 'Selected area' }).textContent).toBe('Showing Selected area');
  });

  it('when Right arrow is pressed on a tab, then the next tab is selected, focused and the only tab stop', () => {
    render(<Panel />);
    tab('Selected area').focus();
    fireEvent.keyDown(tab('Selected area'), { key: 'ArrowRight' });
    expect(selectedTabs()).toEqual(['All areas']);
    expect(document.activeElement).toBe(tab('All areas'));
    expect(tabStops()).toEqual(['All areas']);
    expect(screen.getByRole('tabpanel').textContent).toBe('Showing All areas');
  });

  it('when Left arrow is pressed on the first tab, then selection wraps to the last; Right on the last wraps to the first', () => {
    render(<Panel />);
    fireEvent.keyDown(tab('Selected area'), { key: 'ArrowLeft' });
    expect(document.activeElement).toBe(tab('Revisions'));
    expect(selectedTabs()).toEqual(['Revisions']);
    fireEvent.keyDown(tab('Revisions'), { key: 'ArrowRight' });
    expect(document.activeElement).toBe(tab('Selected area'));
    expect(selectedTabs()).toEqual(['Selected area']);
  });

  it('when End and Home are pressed, then the last and first tabs are selected', () => {
    render(<Panel />);
    fireEvent.keyDown(tab('Selected area'), { key: 'End' });
    expect(selectedTabs()).toEqual(['Revisions']);
    fireEvent.keyDown(tab('Revisions'), { key: 'Home' });
    expect(selectedTabs()).toEqual(['Selected area']);
    expect(document.activeElement).toBe(tab('Selected area'));
  });

  it('when another key is pressed, then the selection stays', () => {
    render(<Panel />);
    fireEvent.keyDown(tab('Selected area'), { key: 'ArrowDown' });
    fireEvent.keyDown(tab('Selected area'), { key: 'a' });
    expect(selectedTabs()).toEqual(['Selected area']);
  });

  it('when a tab is clicked, then it is selected', () => {
    render(<Panel />);
    fireEvent.click(tab('Revisions'));
    expect(selectedTabs()).toEqual(['Revisions']);
    expect(tabStops()).toEqual(['Revisions']);
  });
});
