/**
 * Whether ECMWF's ecCodes command-line tools are on this machine. GRIB2 and BUFR intake run
 * them as child processes; without them the app still starts and says what is disabled.
 */
import { execFile } from 'node:child_process';

/** What the intake page and the start-up log say about ecCodes. */
export interface EccodesStatus {
  available: boolean;
  /** ecCodes version, e.g. "2.28.0"; null when the tools are missing. */
  version: string | null;
  /** One sentence for people: what works, or what is disabled and how to install it. */
  message: string;
}

/** How to install the tools (Debian package name and the project's own script). */
export const ECCODES_INSTALL_HINT = 'Install the Debian package libeccodes-tools (`sudo apt-get install libeccodes-tools`, or run `bash tests/ensure-eccodes.sh`), then restart Stormdraft.';

let cached: Promise<EccodesStatus> | undefined;

function probe(): Promise<EccodesStatus> {
  return new Promise((resolve) => {
    execFile('codes_info', ['-v'], { timeout: 5000, maxBuffer: 64 * 1024 }, (error, stdout) => {
      const version = String(stdout).trim();
      if (error || !/^\d+\.\d+/.test(version)) {
        resolve({ available: false, version: null, message: `GRIB2 and BUFR intake are disabled: the ecCodes tools are not installed. ${ECCODES_INSTALL_HINT}` });
        return;
      }
      resolve({ available: true, version, message: `GRIB2 and BUFR intake use ecCodes ${version}.` });
    });
  });
}

/**
 * Whether the ecCodes tools can be run, with their version (probed once per process).
 * @param options.refresh - probe again (after installing the tools)
 */
export function eccodesStatus(options: { refresh?: boolean } = {}): Promise<EccodesStatus> {
  if (options.refresh || !cached) cached = probe();
  return cached;
}

/** True when the ecCodes tools can be run. */
export async function eccodesAvailable(): Promise<boolean> {
  return (await eccodesStatus()).available;
}
