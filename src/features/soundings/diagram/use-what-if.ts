import { useCallback, useMemo, useState } from 'react';
import type { SoundingLevel } from '../../../../shared/sounding';
import { recomputeWhatIf, type WhatIfChange, type WhatIfResult } from './what-if';

export interface WhatIfState {
  change: WhatIfChange;
  /** Merge a partial change into the current one. */
  update: (partial: WhatIfChange) => void;
  reset: () => void;
  /** The original sounding analysed (with the same chosen start level, for fair deltas). */
  original: WhatIfResult;
  /** The sounding with the change applied, analysed at once in the browser. */
  modified: WhatIfResult;
  isModified: boolean;
}

/** What-if state of a sounding, recomputed synchronously with the shared engine (useMemo). */
export function useWhatIf(levels: readonly SoundingLevel[]): WhatIfState {
  const [change, setChange] = useState<WhatIfChange>({});
  const start = change.parcelStartPressureHpa;
  const original = useMemo(() => recomputeWhatIf(levels, { parcelStartPressureHpa: start }), [levels, start]);
  const modified = useMemo(
    () =>
      change.surfaceTemperatureC === undefined && change.surfaceDewpointC === undefined ? original : recomputeWhatIf(levels, change),
    [levels, change, original],
  );
  const update = useCallback((partial: WhatIfChange) => setChange((old) => ({ ...old, ...partial })), []);
  const reset = useCallback(() => setChange({}), []);
  const isModified = change.surfaceTemperatureC !== undefined || change.surfaceDewpointC !== undefined || start !== undefined;
  return { change, update, reset, original, modified, isModified };
}
