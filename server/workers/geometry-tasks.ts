import { renderMapPng, renderMapSvg, type MapImageInput } from '../exports/map-image';
import { buildEvidenceReport, type AreaEvidenceReport, type EvidenceReportInput } from './evidence-report';
import { contourField, type FieldContours, type GridField } from '../../shared/model-fields/contour-field';
import { fieldDefinitions } from '../../shared/model-fields/field-bands';
import type { KeyFigureKey } from '../../shared/sounding/key-figures';
import { buildGridEvidenceReport, type GridEvidenceReport, type GridEvidenceReportInput } from './grid-evidence-report';
import { matchSubscribers, type MatchSubscribersInput, type MatchSubscribersOutput } from './match-subscribers';

/**
 * The heavy geometry work that must not run on the server's event loop, as tasks for the
 * worker pool (geometry-pool.ts). Each task is plain data in and out.
 */
export type GeometryTask =
  | { kind: 'evidence-report'; input: EvidenceReportInput }
  | { kind: 'match-subscribers'; input: MatchSubscribersInput }
  | { kind: 'render-map'; input: MapImageInput; format: 'svg' | 'png' }
  | { kind: 'grid-evidence-report'; input: GridEvidenceReportInput }
  | { kind: 'field-contours'; input: { field: GridField; figure: KeyFigureKey } };

export interface GeometryTaskResults {
  'evidence-report': AreaEvidenceReport[];
  'match-subscribers': MatchSubscribersOutput;
  'render-map': string;
  'field-contours': FieldContours;
  'grid-evidence-report': GridEvidenceReport;
}

/** A task as sent to a worker; `drill` is a test-only instruction to make the worker die first. */
export type GeometryEnvelope = GeometryTask & { drill?: 'exit' };

/** Runs one task inside a worker thread. Rendered PNGs travel back as base64 text. */
export function runGeometryTask(task: GeometryEnvelope): GeometryTaskResults[GeometryTask['kind']] {
  if (task.drill === 'exit') {
    // Test-only: stands in for a native renderer crash that ends the thread mid-task.
    process.exit(70);
  }
  switch (task.kind) {
    case 'evidence-report':
      return buildEvidenceReport(task.input);
    case 'match-subscribers':
      return matchSubscribers(task.input);
    case 'render-map':
      return task.format === 'svg' ? renderMapSvg(task.input) : renderMapPng(task.input).toString('base64');
    case 'grid-evidence-report':
      return buildGridEvidenceReport(task.input);
    case 'field-contours':
      return contourField(task.input.field, fieldDefinitions[task.input.figure]);
  }
}
