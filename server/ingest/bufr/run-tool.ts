/**
 * Runs one ecCodes command-line tool as a child process with a time limit and a limit on what it
 * may print, so a hostile or broken file can neither hang the server nor fill its memory.
 */
import { spawn } from 'node:child_process';
import { err, ok, type Result } from '../../../shared/result';

export interface ToolLimits {
  /** Wall-clock limit, ms; past it the child is killed. */
  timeoutMs: number;
  /** Most bytes of standard output kept; past it the child is killed. */
  maxOutputBytes: number;
  signal?: AbortSignal | undefined;
}

/** Why a run failed, in words for the intake list (never the raw stderr beyond one short line). */
export type ToolFailure =
  | { kind: 'missing'; reason: string }
  | { kind: 'timeout'; reason: string }
  | { kind: 'too-large'; reason: string }
  | { kind: 'aborted'; reason: string }
  | { kind: 'failed'; reason: string };

/** The first line of the tool's error output, trimmed and shortened (it may quote the file). */
function firstLine(text: string): string {
  const line = text.split('\n').map((l) => l.trim()).find((l) => l !== '') ?? '';
  return line.length > 200 ? `${line.slice(0, 200)}…` : line;
}

/**
 * Runs `command args`, resolving with its standard output as text.
 * @param command - the tool, e.g. "bufr_dump" (found on PATH)
 * @param args - its arguments; never passed through a shell
 * @param limits - time and output limits
 */
export function runTool(command: string, args: string[], limits: ToolLimits): Promise<Result<string, ToolFailure>> {
  return new Promise((resolve) => {
    const child = spawn(command, args, { stdio: ['ignore', 'pipe', 'pipe'] });
    const chunks: Buffer[] = [];
    let size = 0;
    let stderr = '';
    let settled = false;
    const finish = (result: Result<string, ToolFailure>) => {
      if (settled) return;
      settled = true;
      clearTimeout(timer);
      limits.signal?.removeEventListener('abort', onAbort);
      resolve(result);
    };
    const stop = (failure: ToolFailure) => {
      child.kill('SIGKILL');
      finish(err(failure));
    };
    const timer = setTimeout(() => stop({ kind: 'timeout', reason: `${command} did not finish within ${Math.round(limits.timeoutMs / 1000)} s, the limit per file.` }), limits.timeoutMs);
    const onAbort = () => stop({ kind: 'aborted', reason: 'The intake was stopped before this file was finished.' });
    if (limits.signal?.aborted) return onAbort();
    limits.signal?.addEventListener('abort', onAbort);
    child.stdout.on('data', (chunk: Buffer) => {
      size += chunk.length;
      if (size > limits.maxOutputBytes) return stop({ kind: 'too-large', reason: `The decoded content is larger than ${Math.round(limits.maxOutputBytes / 1_000_000)} MB, the limit per file. Split the file and send the parts.` });
      chunks.push(chunk);
    });
    child.stderr.on('data', (chunk: Buffer) => {
      if (stderr.length < 4000) stderr += chunk.toString('utf8');
    });
    child.on('error', (error: NodeJS.ErrnoException) => {
      if (error.code === 'ENOENT') finish(err({ kind: 'missing', reason: `${command} is not installed: GRIB2 and BUFR files need ecCodes (Debian package libeccodes-tools).` }));
      else finish(err({ kind: 'failed', reason: `${command} could not be started (${error.code ?? 'unknown error'}).` }));
    });
    child.on('close', (code) => {
      const stdout = Buffer.concat(chunks).toString('utf8');
      if (code === 0) return finish(ok(stdout));
      const detail = firstLine(stderr) || firstLine(stdout.replace(/[{}[\]"]/g, ' '));
      finish(err({ kind: 'failed', reason: `${command} could not read the file${detail ? ` (${detail})` : ''}.` }));
    });
  });
}
