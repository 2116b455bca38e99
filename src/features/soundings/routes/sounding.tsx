import type { QueryClient } from '@tanstack/react-query';
import { useLocation, useParams, type LoaderFunctionArgs } from 'react-router';
import { z } from 'zod';
import { Button } from '../../../components/ui/button';
import { Loading } from '../../../components/ui/loading';
import { Notice } from '../../../components/ui/notice';
import { useOffice } from '../../../hooks/use-office';
import { useUnits } from '../../../hooks/use-units';
import { useState } from 'react';
import { soundingQuery, useSounding } from '../api/get-sounding';
import { SoundingHeader } from '../components/sounding-header';
import { SoundingFlags } from '../components/sounding-flags';
import { SoundingMetadataForm } from '../components/sounding-metadata-form';
import { SoundingWarnings } from '../components/sounding-warnings';
import { SoundingDiagramArea } from '../components/sounding-diagram-area';

/** Warms the sounding while the page code loads. */
export const soundingLoader =
  (queryClient: QueryClient) =>
  ({ params }: LoaderFunctionArgs) =>
    params.soundingId ? queryClient.prefetchQuery(soundingQuery(params.soundingId)) : Promise.resolve();

/** Set by the what-if save so the new sounding's page can confirm it. */
const savedStateSchema = z.object({ savedModification: z.string() });

export function SoundingPage() {
  const { soundingId = '' } = useParams();
  const sounding = useSounding(soundingId);
  const office = useOffice();
  const units = useUnits();
  const location = useLocation();
  const saved = savedStateSchema.safeParse(location.state);
  const [dismissedKey, setDismissedKey] = useState<string | null>(null);

  if (sounding.isPending) return <Loading label="Loading the sounding…" />;
  if (sounding.isError) {
    return (
      <Notice tone="error" title="We could not open this sounding">
        {sounding.error.message}
      </Notice>
    );
  }
  const data = sounding.data;
  return (
    <>
      <SoundingHeader sounding={data} timeZone={office.data?.timeZone ?? 'UTC'} units={units} />
      {saved.success && dismissedKey !== location.key ? (
        <Notice
          tone="success"
          className="mb-4"
          title={`Saved “${saved.data.savedModification}” as a modified sounding`}
          actions={
            <Button size="sm" variant="ghost" onClick={() => setDismissedKey(location.key)}>
              Dismiss
            </Button>
          }
        >
          This is the new sounding. The original is unchanged; both appear in the library and on the map, this one marked as modified.
        </Notice>
      ) : null}
      <SoundingMetadataForm key={`${data.id}-metadata`} sounding={data} />
      <SoundingFlags analysis={data.analysis} />
      <SoundingWarnings warnings={data.warnings} />
      {/* Keyed by id: a saved what-if opens fresh, not with the original's edits still applied. */}
      <SoundingDiagramArea key={data.id} sounding={data} />
    </>
  );
}
