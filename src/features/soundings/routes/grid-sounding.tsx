import type { QueryClient } from '@tanstack/react-query';
import { useQuery } from '@tanstack/react-query';
import { useParams, type LoaderFunctionArgs } from 'react-router';
import { ButtonLink } from '../../../components/ui/button';
import { Loading } from '../../../components/ui/loading';
import { Notice } from '../../../components/ui/notice';
import { PageHeader } from '../../../components/ui/page-header';
import { Panel } from '../../../components/ui/panel';
import { useUnits } from '../../../hooks/use-units';
import { formatTimestampUtc } from '../../../utils/time';
import { gridSoundingQuery } from '../api/model-runs';
import { figureDefinitions, mapFigureKeys } from '../utils/sounding-figures';

/** Warms the grid sounding while the page code loads. */
export const gridSoundingLoader =
  (queryClient: QueryClient) =>
  ({ params }: LoaderFunctionArgs) =>
    params.gridSoundingId ? queryClient.prefetchQuery(gridSoundingQuery(params.gridSoundingId)) : Promise.resolve();

const orDash = (value: number | null, decimals: number) => (value === null ? '—' : value.toFixed(decimals));

/** A model grid sounding (`runId:pointIndex`): where and when, its key figures and its levels. */
export function GridSoundingPage() {
  const { gridSoundingId = '' } = useParams();
  const sounding = useQuery(gridSoundingQuery(gridSoundingId));
  const units = useUnits();
  if (sounding.isPending) return <Loading label="Loading the grid sounding…" />;
  if (sounding.isError) {
    return (
      <Notice tone="error" title="We could not open this grid sounding">
        {sounding.error.message}
      </Notice>
    );
  }
  const data = sounding.data;
  return (
    <>
      <PageHeader
        title={`${data.model} grid point ${data.pointIndex}`}
        description={`Run of ${formatTimestampUtc(data.cycleTime)} +${data.forecastHour} h, valid ${formatTimestampUtc(data.validTime)} · ${data.latitude.toFixed(3)}, ${data.longitude.toFixed(3)}${data.elevationM !== null ? ` · ground ${Math.round(data.elevationM)} m` : ''}`}
        actions={
          <ButtonLink to={`/soundings?run=${encodeURIComponent(data.runId)}`} variant="secondary">
            Back to the run
          </ButtonLink>
        }
      />
      <div className="grid gap-4 lg:grid-cols-[18rem_1fr]">
        <Panel title="Key figures">
          <dl className="grid grid-cols-[1fr_auto] gap-x-3 gap-y-1 text-[13px]">
            {mapFigureKeys.map((key) => (
              <div key={key} className="contents">
                <dt className="text-ink-muted">{figureDefinitions[key].name}</dt>
                <dd className="text-right tabular-nums">{figureDefinitions[key].format(data.keyFigures[key] ?? null, units)}</dd>
              </div>
            ))}
          </dl>
        </Panel>
        <Panel title="Levels" description="Lowest first; heights above sea level. Levels below the model ground were dropped at intake.">
          <table className="w-full text-right text-[13px] tabular-nums">
            <caption className="sr-only">Levels of the grid sounding</caption>
            <thead className="text-ink-muted">
              <tr>
                <th scope="col" className="py-1 pr-3 font-medium">Pressure hPa</th>
                <th scope="col" className="py-1 pr-3 font-medium">Height m</th>
                <th scope="col" className="py-1 pr-3 font-medium">Temperature °C</th>
                <th scope="col" className="py-1 pr-3 font-medium">Dewpoint °C</th>
                <th scope="col" className="py-1 pr-3 font-medium">u m/s</th>
                <th scope="col" className="py-1 font-medium">v m/s</th>
              </tr>
            </thead>
            <tbody>
              {data.levels.map((level) => (
                <tr key={level.pressureHpa} className="border-t border-line">
                  <td className="py-1 pr-3">{level.pressureHpa.toFixed(1)}</td>
                  <td className="py-1 pr-3">{Math.round(level.heightM)}</td>
                  <td className="py-1 pr-3">{level.temperatureC.toFixed(1)}</td>
                  <td className="py-1 pr-3">{orDash(level.dewpointC, 1)}</td>
                  <td className="py-1 pr-3">{orDash(level.uMs, 1)}</td>
                  <td className="py-1">{orDash(level.vMs, 1)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </Panel>
      </div>
    </>
  );
}
