import { clsx } from 'clsx';
import type { Units } from '../../../../shared/contracts/users';
import type { SoundingLevel } from '../../../../shared/sounding';
import { MISSING, formatNumber, heightText, speedText, temperatureText } from './format';
import { levelWind } from './profile-helpers';

export interface LevelsTableProps {
  levels: readonly SoundingLevel[];
  units: Units;
  caption?: string;
  className?: string;
}

/** The sounding's levels as a table: the diagram's data for screen readers and keyboard users. */
export function LevelsTable({ levels, units, caption = 'Sounding levels', className }: LevelsTableProps) {
  return (
    <div className={clsx('max-h-96 overflow-auto rounded-md border border-line', className)} tabIndex={0} role="region" aria-label={caption}>
      <table className="w-full border-collapse text-[13px] tabular-nums">
        <caption className="sr-only">{caption}</caption>
        <thead className="sticky top-0 bg-sunken text-ink-muted">
          <tr>
            {['Pressure (hPa)', 'Height (MSL)', 'Temperature', 'Dewpoint', 'Wind direction', 'Wind speed'].map((heading) => (
              <th key={heading} scope="col" className="px-2 py-1.5 text-right font-medium">
                {heading}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {levels.map((level, index) => {
            const wind = levelWind(level);
            return (
              <tr key={`${level.pressureHpa}-${index}`} className="border-t border-line/60">
                <th scope="row" className="px-2 py-1 text-right font-medium text-ink">
                  {formatNumber(level.pressureHpa, level.pressureHpa % 1 === 0 ? 0 : 1)}
                </th>
                <td className="px-2 py-1 text-right">{heightText(level.heightM, units)}</td>
                <td className="px-2 py-1 text-right">{temperatureText(level.temperatureC, units)}</td>
                <td className="px-2 py-1 text-right">{level.dewpointC === null ? MISSING : temperatureText(level.dewpointC, units)}</td>
                <td className="px-2 py-1 text-right">{wind ? `${String(Math.round(wind.directionDeg) % 360).padStart(3, '0')}°` : MISSING}</td>
                <td className="px-2 py-1 text-right">{wind ? speedText(wind.speedMs, units) : MISSING}</td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
