/** Sounding diagram components and their pure helpers (issue 4, items 3 and 4). */
export { SoundingWorkbench, type SoundingWorkbenchProps } from './sounding-workbench';
export { SkewTDiagram, type SkewTDiagramProps, type SurfaceChange } from './skew-t-diagram';
export { Hodograph, type HodographProps } from './hodograph';
export { IndexPanel, type IndexPanelProps } from './index-panel';
export { LevelsTable, type LevelsTableProps } from './levels-table';
export { WhatIfEditor, type WhatIfEditorProps } from './what-if-editor';
export { useWhatIf, type WhatIfState } from './use-what-if';
export {
  analyzeForDiagram,
  applySurfaceChange,
  liftChosenParcel,
  measureRecomputeMs,
  parcelStartOptions,
  recomputeWhatIf,
  whatIfProblem,
  type WhatIfChange,
  type WhatIfResult,
} from './what-if';
export { describeDeltas, type DeltaDescription } from './describe-deltas';
export { indexGroups, type IndexGroup, type IndexRow } from './index-rows';
export { skewT, pathThrough, type SkewT, type SkewTFrame, type Point } from './skew-t-geometry';
export { decomposeBarb, barbShape, type BarbParts } from './wind-barb';
export { PARCEL_LABELS, type ParcelKey } from './parcels';
export { SOUNDING_PALETTE, HODOGRAPH_BANDS } from './palette';
