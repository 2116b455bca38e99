import { useMemo, useState } from 'react';
import { keyFigureKeys, type KeyFigureKey } from '../../../shared/sounding/key-figures';
import { isFieldFigure } from '../../../shared/model-fields/field-bands';
import { useFieldRuns } from '../../api/model-fields/get-field-runs';
import { useModelField } from '../../api/model-fields/get-model-field';

/**
 * The model-field layer of a map: which run (none by default) and which key figure, the runs to
 * pick from, the bands for the map and the field for its legend.
 */
export function useFieldLayer() {
  const [runId, setRunId] = useState<string | null>(null);
  const [figure, setFigure] = useState<KeyFigureKey>('mlCape');
  const runs = useFieldRuns();
  const known = runId !== null && (runs.data?.runs.some((r) => r.id === runId) ?? false);
  const field = useModelField(known ? runId : null, figure);
  const mapField = useMemo(() => (known && field.data ? { bands: field.data.features, fieldKey: `${field.data.run.id}/${field.data.figure}` } : null), [known, field.data]);
  return {
    runs: runs.data?.runs ?? [],
    runId: known ? runId : null,
    setRunId,
    figure,
    setFigure: (value: string) => {
      if (isFieldFigure(value)) setFigure(value);
    },
    figures: keyFigureKeys,
    field: known ? (field.data ?? null) : null,
    loading: known && field.isFetching,
    error: runs.error ?? (known ? field.error : null),
    mapField,
  };
}

export type FieldLayer = ReturnType<typeof useFieldLayer>;
