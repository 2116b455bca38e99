import { SelectField } from '../ui/field';
import { fieldDefinitions } from '../../../shared/model-fields/field-bands';
import { runName } from './field-display';
import type { FieldLayer } from './use-field-layer';

/** Pickers for the model field under a map: the run (or none) and the key figure. */
export function FieldControls({ layer }: { layer: FieldLayer }) {
  return (
    <>
      <SelectField
        label="Model field"
        className="w-72"
        value={layer.runId ?? ''}
        options={[{ value: '', label: layer.runs.length ? 'None' : 'No model runs yet' }, ...layer.runs.map((run) => ({ value: run.id, label: `${runName(run)} (valid ${run.validTime.slice(11, 16)} UTC ${run.validTime.slice(5, 10)})` }))]}
        onChange={(event) => layer.setRunId(event.target.value === '' ? null : event.target.value)}
      />
      <SelectField
        label="Field figure"
        className="w-56"
        value={layer.figure}
        disabled={layer.runId === null}
        options={layer.figures.map((key) => ({ value: key, label: fieldDefinitions[key].label }))}
        onChange={(event) => layer.setFigure(event.target.value)}
      />
    </>
  );
}
