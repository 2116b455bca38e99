/**
 * Worker-thread task of the sounding upload: parse one exchange-CSV file (or validate one
 * structured sounding) and analyse it, off the server's event loop. Pure: no database.
 */
import { analyzeSounding, parseSoundingCsv, validateSounding, type ParsedSounding, type SoundingAnalysis, type SoundingIssue } from '../../shared/sounding';

/** What the pool sends: a CSV text with its file name, or a structured sounding. */
export type SoundingTask = { kind: 'csv'; fileName: string; text: string } | { kind: 'structured'; input: unknown };

/** What the worker answers: the parsed sounding with its analysis, or the issues. */
export type SoundingTaskResult = { ok: true; parsed: ParsedSounding; analysis: SoundingAnalysis } | { ok: false; issues: SoundingIssue[] };

/**
 * Parse (or validate) and analyse one sounding.
 * @param task - the file or structured input
 * @returns the sounding and its analysis, or the issues that refuse it
 */
export function analyzeSoundingTask(task: SoundingTask): SoundingTaskResult {
  const parsed = task.kind === 'csv' ? parseSoundingCsv(task.text, task.fileName) : validateSounding(task.input);
  if (!parsed.ok) return { ok: false, issues: parsed.error };
  return { ok: true, parsed: parsed.value, analysis: analyzeSounding(parsed.value.levels, { latitude: parsed.value.metadata.latitude }) };
}

export default analyzeSoundingTask;
