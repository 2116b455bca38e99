import type { IntakeFile } from '../../../../shared/contracts/intake';

/** "1.2 MB", "340 kB", "512 B". */
export function formatBytes(bytes: number): string {
  if (bytes >= 1_000_000) return `${(bytes / 1_000_000).toFixed(1)} MB`;
  if (bytes >= 1_000) return `${Math.round(bytes / 1_000)} kB`;
  return `${bytes} B`;
}

/** "0.4 s", "1 min 05 s"; an em dash while still running. */
export function formatDuration(ms: number | null): string {
  if (ms === null) return '—';
  if (ms < 60_000) return `${(ms / 1000).toFixed(1)} s`;
  const minutes = Math.floor(ms / 60_000);
  const seconds = Math.round((ms % 60_000) / 1000);
  return `${minutes} min ${String(seconds).padStart(2, '0')} s`;
}

const stateLabels: Record<IntakeFile['state'], string> = {
  received: 'Received',
  processing: 'Taking in',
  done: 'Done',
  failed: 'Failed',
  duplicate: 'Duplicate',
};

const formatLabels: Record<IntakeFile['format'], string> = { grib2: 'GRIB2', bufr: 'BUFR', csv: 'CSV', unknown: 'Unknown' };

export const stateLabel = (state: IntakeFile['state']) => stateLabels[state];
export const formatLabel = (format: IntakeFile['format']) => formatLabels[format];

/** The progress of a file being taken in, e.g. "12 of 40 soundings analysed"; null when there is none to show. */
export function progressText(file: Pick<IntakeFile, 'state' | 'progressDone' | 'progressTotal'>): string | null {
  if (file.state !== 'processing') return null;
  if (file.progressTotal === 0) return 'Decoding…';
  return `${file.progressDone} of ${file.progressTotal} soundings analysed`;
}

/** What the file produced, in words. */
export function outcomeText(file: Pick<IntakeFile, 'state' | 'soundingCount' | 'duplicateSoundingCount' | 'runIds'>): string {
  if (file.state === 'duplicate') return 'Already taken in';
  if (file.state !== 'done') return '—';
  const parts = [`${file.soundingCount} new`];
  if (file.duplicateSoundingCount > 0) parts.push(`${file.duplicateSoundingCount} already stored`);
  if (file.runIds.length > 0) parts.push(`${file.runIds.length} model run${file.runIds.length === 1 ? '' : 's'}`);
  return parts.join(' · ');
}
