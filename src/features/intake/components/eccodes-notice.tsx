import type { IntakeStatus } from '../../../../shared/contracts/intake';
import { Notice } from '../../../components/ui/notice';

/** Says plainly when GRIB2 and BUFR cannot be read on this server, and how to fix it. */
export function EccodesNotice({ status }: { status: IntakeStatus }) {
  if (status.eccodes.available) return null;
  return (
    <Notice tone="warning" title="GRIB2 and BUFR files cannot be read: ecCodes is not installed" className="mb-4">
      <p>Model fields (GRIB2) and radiosonde observations (BUFR) need ecCodes, Debian package libeccodes-tools. Sounding CSV files are still taken in.</p>
      <p className="mt-1">
        Install it on the server with <code className="font-mono text-[13px]">sudo apt-get update && sudo apt-get install -y libeccodes-tools</code>, then drop the files again.
      </p>
    </Notice>
  );
}
