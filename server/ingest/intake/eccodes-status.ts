/**
 * Whether ecCodes' command-line tools are installed. GRIB2 and BUFR need them; the app starts
 * and takes CSV files without them, and the intake page says how to install them.
 */
import { runTool } from '../bufr/run-tool';

export interface EccodesStatus {
  available: boolean;
  version: string | null;
}

/** What the intake page tells a person when ecCodes is missing. */
export const ECCODES_INSTALL_HINT = 'GRIB2 and BUFR files need ecCodes, Debian package libeccodes-tools: sudo apt-get update && sudo apt-get install -y libeccodes-tools (the project test script installs it when missing). CSV files are taken without it.';

let cached: { at: number; status: EccodesStatus } | undefined;

/** Checks (at most once a minute) by running `codes_info -v`. */
export async function eccodesStatus(now = Date.now()): Promise<EccodesStatus> {
  if (cached && now - cached.at < 60_000) return cached.status;
  const out = await runTool('codes_info', ['-v'], { timeoutMs: 10_000, maxOutputBytes: 10_000 });
  const status: EccodesStatus = out.ok ? { available: true, version: out.value.trim().split('\n')[0]?.trim() || null } : { available: false, version: null };
  cached = { at: now, status };
  return status;
}

/** True when ecCodes' tools can be run. */
export async function eccodesAvailable(): Promise<boolean> {
  return (await eccodesStatus()).available;
}
