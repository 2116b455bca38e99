// @vitest-environment jsdom
import { render, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { fieldBands, fieldDefinitions } from '../../../shared/model-fields/field-bands';
import type { ModelField } from '../../../shared/contracts/model-fields';
import { evidenceSourceLabels } from './field-display';
import { FieldLegend } from './field-legend';

const run = { id: 'r1', model: 'VALLEY3', cycleTime: '2031-06-01T12:00:00.000Z', forecastHour: 6, validTime: '2031-06-01T18:00:00.000Z', gridKind: 'lambert', nx: 4, ny: 4, soundingCount: 16 };
const dewpointField: ModelField = {
  run,
  figure: 'surfaceDewpointC',
  label: 'Surface dewpoint',
  unit: '°C',
  quantity: 'temperature',
  sense: 'above',
  bands: fieldBands(fieldDefinitions.surfaceDewpointC),
  valuedPoints: 16,
  stride: 1,
  features: { type: 'FeatureCollection', features: [] },
};

describe('FieldLegend', () => {
  it('when the person reads °F, then the dewpoint bands are shown in °F and the run is named', () => {
    render(<FieldLegend field={dewpointField} units={{ temperature: 'F', height: 'm', speed: 'kt' }} />);
    const key = screen.getByRole('figure', { name: 'Field key: Surface dewpoint' });
    expect(within(key).getByText('Surface dewpoint · VALLEY3 2031-06-01 12Z +6 h')).toBeTruthy();
    // 20 °C is 68 °F and 22 °C is 71.6 °F (°F = °C × 9/5 + 32, the definition of the scale).
    expect(within(key).getByText('68 to 72 °F')).toBeTruthy();
    expect(within(key).getByText(/own choice/)).toBeTruthy();
  });

  it('when the person reads °C, then the top band is open-ended in °C', () => {
    render(<FieldLegend field={dewpointField} units={{ temperature: 'C', height: 'm', speed: 'kt' }} />);
    expect(screen.getByText('≥ 22 °C')).toBeTruthy();
  });
});

describe('evidenceSourceLabels', () => {
  it('when an area holds grid soundings of a run and observed ones, then each source is named with its count', () => {
    const labels = evidenceSourceLabels({ runs: [run], sourcesByArea: { a1: [{ runId: null, count: 2 }, { runId: 'r1', count: 40 }] } }, 'a1');
    expect(labels).toEqual([
      { label: 'observed and uploaded soundings', count: 2 },
      { label: 'VALLEY3 2031-06-01 12Z +6 h', count: 40 },
    ]);
    expect(evidenceSourceLabels(undefined, 'a1')).toEqual([]);
  });
});
