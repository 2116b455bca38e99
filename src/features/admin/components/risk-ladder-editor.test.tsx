import { cleanup, fireEvent, render, screen, within } from '@testing-library/react';
import { useState } from 'react';
import { afterEach, describe, expect, it } from 'vitest';
import { defaultRiskLadder } from '../../../../shared/contracts/office';
import { toEditableLadder, toRiskLadder, type EditableLevel } from '../utils/risk-ladder-edits';
import { RiskLadderEditor } from './risk-ladder-editor';

afterEach(cleanup);

let latest: EditableLevel[] = [];

function Harness({ initial }: { initial: EditableLevel[] }) {
  const [rows, setRows] = useState(initial);
  return (
    <RiskLadderEditor
      rows={rows}
      onChange={(next) => {
        latest = next;
        setRows(next);
      }}
    />
  );
}

const previewLabels = () =>
  within(screen.getByRole('group', { name: 'Preview of the risk ladder' }))
    .getAllByRole('listitem')
    .map((item) => item.textContent);

describe('risk ladder editor', () => {
  it('moves a level down and up, keeping the preview in the new order', () => {
    render(<Harness initial={toEditableLadder(defaultRiskLadder)} />);
    fireEvent.click(screen.getByRole('button', { name: 'Move Thunderstorms down' }));
    expect(previewLabels().slice(0, 2)).toEqual(['Level 1 · Isolated', 'Thunderstorms']);
    fireEvent.click(screen.getByRole('button', { name: 'Move Thunderstorms up' }));
    expect(toRiskLadder(latest).map((level) => level.key)).toEqual(['thunder', 'level1', 'level2', 'level3', 'level4', 'level5']);
  });

  it('cannot move the first level up or the last level down', () => {
    render(<Harness initial={toEditableLadder(defaultRiskLadder)} />);
    expect(screen.getByRole('button', { name: 'Move Thunderstorms up' }).hasAttribute('disabled')).toBe(true);
    expect(screen.getByRole('button', { name: 'Move Level 5 · Outbreak down' }).hasAttribute('disabled')).toBe(true);
  });

  it('adds a new highest level with an unused key, and removes a level', () => {
    render(<Harness initial={toEditableLadder(defaultRiskLadder)} />);
    fireEvent.click(screen.getByRole('button', { name: 'Add level' }));
    expect(latest).toHaveLength(7);
    expect(latest[6]?.key).toBe('level6');
    fireEvent.click(screen.getByRole('button', { name: 'Remove Level 2 · Scattered' }));
    expect(latest.map((level) => level.key)).toEqual(['thunder', 'level1', 'level3', 'level4', 'level5', 'level6']);
  });

  it('resets an edited ladder to the defaults', () => {
    render(<Harness initial={toEditableLadder(defaultRiskLadder.slice(0, 2))} />);
    fireEvent.click(screen.getByRole('button', { name: 'Reset to defaults' }));
    expect(toRiskLadder(latest)).toEqual(defaultRiskLadder);
  });

  it('shows white text on the darkest levels and dark text on the lightest, and follows a typed colour', () => {
    render(<Harness initial={toEditableLadder(defaultRiskLadder)} />);
    const swatch = (label: string) =>
      within(screen.getByRole('group', { name: 'Preview of the risk ladder' })).getByText(label);
    expect(swatch('Level 5 · Outbreak').getAttribute('data-text-colour')).toBe('#ffffff');
    expect(swatch('Thunderstorms').getAttribute('data-text-colour')).toBe('#111827');

    const thunderRow = screen.getByRole('listitem', { name: 'Risk level 1: Thunderstorms' });
    fireEvent.change(within(thunderRow).getByLabelText('Colour'), { target: { value: '#101010' } });
    expect(swatch('Thunderstorms').getAttribute('data-text-colour')).toBe('#ffffff');
  });

  it('shows a server message beside the field it belongs to', () => {
    render(
      <RiskLadderEditor
        rows={toEditableLadder(defaultRiskLadder)}
        onChange={() => undefined}
        errors={{ 'riskLadder.2.key': 'The key "level1" is used twice.' }}
      />,
    );
    const row = screen.getByRole('listitem', { name: 'Risk level 3: Level 2 · Scattered' });
    expect(within(row).getByText('The key "level1" is used twice.')).toBeDefined();
  });
});
