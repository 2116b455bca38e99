import { describe, expect, it } from 'vitest';
import { runTool } from './run-tool';

describe('runTool', () => {
  it('When the tool is not installed, then the failure says ecCodes is needed and names the Debian package', async () => {
    const out = await runTool('bufr_dump_not_installed_here', ['-js', 'x.bufr'], { timeoutMs: 5000, maxOutputBytes: 1000 });
    expect(out).toEqual({ ok: false, error: { kind: 'missing', reason: 'bufr_dump_not_installed_here is not installed: GRIB2 and BUFR files need ecCodes (Debian package libeccodes-tools).' } });
  });

  it('When the tool runs past its time limit, then it is stopped and the failure names the limit', async () => {
    const out = await runTool('sleep', ['5'], { timeoutMs: 200, maxOutputBytes: 1000 });
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.error.kind).toBe('timeout');
  });

  it('When the tool prints more than the output limit, then it is stopped and the failure says the content is too large', async () => {
    const out = await runTool('yes', [], { timeoutMs: 5000, maxOutputBytes: 10_000 });
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.error.kind).toBe('too-large');
  });

  it('When the tool fails, then the reason quotes the first line of its error output', async () => {
    const out = await runTool('sh', ['-c', 'echo "first problem" >&2; echo second >&2; exit 3'], { timeoutMs: 5000, maxOutputBytes: 1000 });
    expect(out).toEqual({ ok: false, error: { kind: 'failed', reason: 'sh could not read the file (first problem).' } });
  });

  it('When the signal is aborted, then the tool is stopped', async () => {
    const controller = new AbortController();
    const running = runTool('sleep', ['5'], { timeoutMs: 10_000, maxOutputBytes: 1000, signal: controller.signal });
    controller.abort();
    const out = await running;
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.error.kind).toBe('aborted');
  });
});
