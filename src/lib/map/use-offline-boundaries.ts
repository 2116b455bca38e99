import { useEffect, useState } from 'react';
import { loadOfflineBoundaries, type BoundaryLevelName, type OfflineBoundaries } from './offline-boundaries';

/** The offline us-atlas boundaries at one level, loaded once per page; `problem` says why they could not be drawn. */
export function useOfflineBoundaries(level: BoundaryLevelName = 'overview'): { boundaries: OfflineBoundaries | null; problem: string | null } {
  const [boundaries, setBoundaries] = useState<OfflineBoundaries | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  useEffect(() => {
    let live = true;
    loadOfflineBoundaries(level).then(
      (loaded) => {
        if (live) setBoundaries(loaded);
      },
      (error: unknown) => {
        if (live) setProblem(error instanceof Error ? error.message : 'The base map could not be drawn.');
      },
    );
    return () => {
      live = false;
    };
  }, [level]);
  return { boundaries, problem };
}
