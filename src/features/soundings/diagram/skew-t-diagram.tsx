import { clsx } from 'clsx';
import { memo, useId, useMemo, useRef, useState, type KeyboardEvent, type PointerEvent } from 'react';
import type { Units } from '../../../../shared/contracts/users';
import type { ParcelResult, SoundingAnalysis, SoundingLevel } from '../../../../shared/sounding';
import { buoyancyAreas } from './buoyancy-areas';
import { DIAGRAM_VIEW, FULL_FRAME, isobarsFor, zoomedFrame } from './diagram-frame';
import {
  DRY_ADIABAT_THETAS_C,
  MIXING_RATIOS_G_PER_KG,
  PSEUDO_ADIABAT_THETA_WS_C,
  dryAdiabats,
  mixingRatioLines,
  pseudoAdiabats,
} from './diagram-lines';
import { heightText, pressureText, speedText, temperatureText, toDisplayTemperature } from './format';
import { DASHES, SOUNDING_PALETTE as C } from './palette';
import { PARCEL_LABELS, STANDARD_PARCELS, parcelOf, type ParcelKey } from './parcels';
import { heightAboveGround, levelVirtualTemperatureC, levelWind, parcelTemperatureAt } from './profile-helpers';
import { pathThrough, skewT, type SkewT } from './skew-t-geometry';
import { barbShape } from './wind-barb';
import { metresPerSecondToKnots } from '../../../utils/units';

export interface SurfaceChange {
  temperatureC?: number;
  dewpointC?: number;
}

export interface SkewTDiagramProps {
  /** Levels sorted by decreasing pressure (heights MSL). */
  levels: readonly SoundingLevel[];
  /** The engine's analysis of these levels, made with `{trace: true}`. */
  analysis: SoundingAnalysis;
  units: Units;
  /** A parcel lifted from a chosen level (what-if), drawn as a fourth option. */
  chosenParcel?: ParcelResult | null;
  /** The parcel whose areas and levels are shown; uncontrolled when omitted. */
  selectedParcel?: ParcelKey;
  onSelectedParcelChange?: (key: ParcelKey) => void;
  /** When given, the surface temperature and dewpoint points can be dragged (and moved with arrow keys). */
  onSurfaceChange?: (change: SurfaceChange) => void;
  /** The observed surface values, drawn as hollow points when the surface has been changed. */
  originalSurface?: { temperatureC: number; dewpointC: number | null } | null;
  /** Accessible name of the diagram. */
  title?: string;
  className?: string;
}

type Handle = 'temperature' | 'dewpoint';

const BARB_X = FULL_FRAME.left + FULL_FRAME.width + 44;
const round1 = (value: number): number => Math.round(value * 10) / 10;

/** Skew-T log-p diagram of a sounding in Stormdraft's own styling. */
export function SkewTDiagram({
  levels,
  analysis,
  units,
  chosenParcel = null,
  selectedParcel,
  onSelectedParcelChange,
  onSurfaceChange,
  originalSurface = null,
  title = 'Skew-T log-p diagram',
  className,
}: SkewTDiagramProps) {
  const id = useId();
  const svgRef = useRef<SVGSVGElement>(null);
  const dragging = useRef<Handle | null>(null);
  const [zoomed, setZoomed] = useState(false);
  const [ownSelection, setOwnSelection] = useState<ParcelKey>('mixedLayer');
  const [visible, setVisible] = useState<Record<(typeof STANDARD_PARCELS)[number], boolean>>({
    surfaceBased: true,
    mixedLayer: true,
    mostUnstable: true,
  });
  const [cursor, setCursor] = useState<number | null>(null);

  const requested = selectedParcel ?? ownSelection;
  const selected: ParcelKey = requested === 'chosen' && !chosenParcel ? 'mixedLayer' : requested;
  const selectParcel = (key: ParcelKey) => {
    setOwnSelection(key);
    onSelectedParcelChange?.(key);
  };
  const selectedResult = parcelOf(analysis, chosenParcel, selected);

  const frame = useMemo(() => {
    if (!zoomed) return FULL_FRAME;
    const traces = [analysis.surfaceBased, analysis.mixedLayer, analysis.mostUnstable, chosenParcel].flatMap((p) => (p?.trace ? [p.trace] : []));
    return zoomedFrame(levels, traces);
  }, [zoomed, levels, analysis, chosenParcel]);
  const transform = useMemo(() => skewT(frame), [frame]);

  const isotherms = useMemo(() => isothermLines(transform), [transform]);
  const areas = useMemo(() => (selectedResult ? buoyancyAreas(levels, selectedResult) : []), [levels, selectedResult]);

  const surface = levels[0];
  const cursorLevel = cursor === null ? undefined : levels[Math.min(cursor, levels.length - 1)];
  const readout = cursorLevel ? readoutLines(levels, cursorLevel, selectedResult, selected, units) : null;

  const toSvgPoint = (clientX: number, clientY: number): { x: number; y: number } | null => {
    const svg = svgRef.current;
    if (!svg) return null;
    const rect = svg.getBoundingClientRect();
    if (rect.width === 0 || rect.height === 0) return null;
    return { x: ((clientX - rect.left) * DIAGRAM_VIEW.width) / rect.width, y: ((clientY - rect.top) * DIAGRAM_VIEW.height) / rect.height };
  };

  const nearestLevel = (pressureHpa: number): number => {
    let best = 0;
    let bestDistance = Infinity;
    levels.forEach((level, index) => {
      const distance = Math.abs(Math.log(level.pressureHpa) - Math.log(pressureHpa));
      if (distance < bestDistance) {
        bestDistance = distance;
        best = index;
      }
    });
    return best;
  };

  const moveSurface = (handle: Handle, temperatureC: number) => {
    if (!surface || !onSurfaceChange) return;
    const value = round1(temperatureC);
    if (handle === 'temperature') {
      onSurfaceChange({ temperatureC: Math.max(value, surface.dewpointC ?? -Infinity) });
    } else {
      onSurfaceChange({ dewpointC: Math.min(value, surface.temperatureC) });
    }
  };

  const onPointerMove = (event: PointerEvent<SVGSVGElement>) => {
    const point = toSvgPoint(event.clientX, event.clientY);
    if (!point) return;
    if (dragging.current && surface) {
      const y = transform.pressureToY(surface.pressureHpa);
      moveSurface(dragging.current, transform.fromPoint({ x: point.x, y }).temperatureC);
      return;
    }
    const inside = point.x >= frame.left && point.x <= frame.left + frame.width && point.y >= frame.top && point.y <= frame.top + frame.height;
    setCursor(inside ? nearestLevel(transform.yToPressure(point.y)) : null);
  };

  const onKeyDown = (event: KeyboardEvent<SVGSVGElement>) => {
    const last = levels.length - 1;
    const current = cursor ?? 0;
    const moves: Record<string, number> = { ArrowUp: current + 1, ArrowDown: current - 1, PageUp: current + 10, PageDown: current - 10, Home: 0, End: last };
    if (event.key === 'Escape') {
      setCursor(null);
      return;
    }
    const next = moves[event.key];
    if (next === undefined) return;
    event.preventDefault();
    setCursor(cursor === null ? 0 : Math.max(0, Math.min(last, next)));
  };

  const handleKeyDown = (handle: Handle) => (event: KeyboardEvent<SVGCircleElement>) => {
    if (!surface) return;
    const step = event.shiftKey ? 2 : 0.5;
    const delta = event.key === 'ArrowRight' || event.key === 'ArrowUp' ? step : event.key === 'ArrowLeft' || event.key === 'ArrowDown' ? -step : 0;
    if (delta === 0) return;
    event.preventDefault();
    event.stopPropagation();
    const now = handle === 'temperature' ? surface.temperatureC : (surface.dewpointC ?? surface.temperatureC);
    moveSurface(handle, now + delta);
  };

  const profilePath = (value: (level: SoundingLevel) => number | null) =>
    pathThrough(levels.map((level) => {
      const t = value(level);
      return t === null ? null : transform.toPoint(level.pressureHpa, t);
    }));

  const visibleParcels: ParcelKey[] = [...STANDARD_PARCELS.filter((key) => visible[key] || key === selected), ...(chosenParcel ? (['chosen'] as const) : [])];
  const clip = `${id}-plot`;
  const hintId = `${id}-hint`;
  const bottom = frame.top + frame.height;
  const right = frame.left + frame.width;
  const markers = selectedResult ? parcelMarkers(selectedResult, transform, units) : [];
  const traceEnds = visibleParcels.flatMap((key) => {
    const trace = parcelOf(analysis, chosenParcel, key)?.trace;
    const last = trace?.[trace.length - 1];
    return last ? [transform.toPoint(last.pressureHpa, last.virtualTemperatureC).x] : [];
  });
  const labelBaseX = traceEnds.length ? Math.min(...traceEnds) : 0;

  return (
    <figure className={clsx('m-0', className)}>
      <div className="mb-2 flex flex-wrap items-center gap-x-4 gap-y-2 text-[13px]">
        <fieldset className="flex flex-wrap items-center gap-x-2">
          <legend className="sr-only">Parcel with shaded areas and levels</legend>
          <span className="font-medium text-ink" aria-hidden="true">Parcel</span>
          {[...STANDARD_PARCELS, ...(chosenParcel ? (['chosen'] as const) : [])].map((key) => (
            <label key={key} className="inline-flex items-center gap-1 text-ink">
              <input type="radio" name={`${id}-parcel`} checked={selected === key} onChange={() => selectParcel(key)} />
              {key === 'chosen' && chosenParcel ? `From ${Math.round(chosenParcel.parcelPressure)} hPa` : PARCEL_LABELS[key].long}
            </label>
          ))}
        </fieldset>
        <fieldset className="flex flex-wrap items-center gap-x-2">
          <legend className="sr-only">Parcel traces shown</legend>
          <span className="font-medium text-ink" aria-hidden="true">Traces</span>
          {STANDARD_PARCELS.map((key) => (
            <label key={key} className="inline-flex items-center gap-1 text-ink">
              <input
                type="checkbox"
                checked={visible[key] || key === selected}
                disabled={key === selected}
                onChange={(event) => setVisible((old) => ({ ...old, [key]: event.target.checked }))}
              />
              <span>
                {PARCEL_LABELS[key].short}
                <span className="sr-only"> trace ({PARCEL_LABELS[key].long})</span>
              </span>
            </label>
          ))}
        </fieldset>
        <button
          type="button"
          aria-pressed={zoomed}
          onClick={() => setZoomed((z) => !z)}
          className={clsx(
            'h-7 rounded-md border px-2.5 font-medium',
            zoomed ? 'border-accent bg-accent-soft text-accent-strong' : 'border-line-strong bg-panel text-ink hover:bg-sunken',
          )}
        >
          Lowest 300 hPa
        </button>
      </div>

      <svg
        ref={svgRef}
        viewBox={`0 0 ${DIAGRAM_VIEW.width} ${DIAGRAM_VIEW.height}`}
        className="block h-auto w-full touch-none select-none rounded-md focus-visible:outline-2"
        role="group"
        aria-label={title}
        aria-describedby={hintId}
        tabIndex={0}
        onKeyDown={onKeyDown}
        onPointerMove={onPointerMove}
        onPointerLeave={() => {
          if (!dragging.current) setCursor(null);
        }}
        onPointerUp={() => {
          dragging.current = null;
        }}
        fontFamily="Public Sans, ui-sans-serif, system-ui, sans-serif"
      >
        <defs>
          <clipPath id={clip}>
            <rect x={frame.left} y={frame.top} width={frame.width} height={frame.height} />
          </clipPath>
        </defs>
        <rect x={0} y={0} width={DIAGRAM_VIEW.width} height={DIAGRAM_VIEW.height} fill="#ffffff" />
        <rect x={frame.left} y={frame.top} width={frame.width} height={frame.height} fill={C.background} />

        <g clipPath={`url(#${clip})`} aria-hidden="true">
          <DiagramBackground transform={transform} />

          {areas.map((area, index) => (
            <path
              key={index}
              d={`${pathThrough(area.outline.map((point) => transform.toPoint(point.pressureHpa, point.temperatureC)))}Z`}
              fill={area.sign === 'positive' ? C.positiveArea : C.negativeArea}
              fillOpacity={0.32}
              stroke="none"
            />
          ))}

          <path d={profilePath(levelVirtualTemperatureC)} stroke={C.temperature} strokeWidth={1} strokeDasharray="2 2" fill="none" opacity={0.7} />
          <path d={profilePath((level) => level.temperatureC)} stroke={C.temperature} strokeWidth={2.4} fill="none" strokeLinejoin="round" />
          <path d={profilePath((level) => level.dewpointC)} stroke={C.dewpoint} strokeWidth={2.4} fill="none" strokeLinejoin="round" />

          {visibleParcels.map((key, order) => {
            const parcel = parcelOf(analysis, chosenParcel, key);
            if (!parcel?.trace) return null;
            const points = parcel.trace.map((point) => transform.toPoint(point.pressureHpa, point.virtualTemperatureC));
            const end = points[points.length - 1];
            const isSelected = key === selected;
            return (
              <g key={key}>
                <path
                  d={pathThrough(points)}
                  stroke={C.parcel}
                  strokeWidth={isSelected ? 1.9 : 1.1}
                  strokeDasharray={isSelected ? undefined : DASHES.otherParcel}
                  opacity={isSelected ? 1 : 0.6}
                  fill="none"
                />
                {end ? (
                  <text x={labelBaseX + 4 + order * 22} y={Math.max(end.y, frame.top + 10)} fontSize={10} fontWeight={isSelected ? 700 : 400} fill={C.parcel}>
                    {PARCEL_LABELS[key].short}
                  </text>
                ) : null}
              </g>
            );
          })}

          {markers.map((marker) => {
            const dx = marker.side === 'right' ? 1 : -1;
            return (
              <g key={marker.name}>
                <line x1={marker.x + 4 * dx} x2={marker.x + 22 * dx} y1={marker.y} y2={marker.y} stroke={C.parcel} strokeWidth={1.5} />
                <text
                  x={marker.x + 25 * dx}
                  y={marker.y + 3.5}
                  textAnchor={marker.side === 'right' ? 'start' : 'end'}
                  fontSize={10.5}
                  fontWeight={600}
                  fill={C.parcel}
                  paintOrder="stroke"
                  stroke="#ffffff"
                  strokeWidth={3}
                >
                  {marker.label}
                </text>
              </g>
            );
          })}

          {cursorLevel ? (
            <line
              x1={frame.left}
              x2={right}
              y1={transform.pressureToY(cursorLevel.pressureHpa)}
              y2={transform.pressureToY(cursorLevel.pressureHpa)}
              stroke={C.cursor}
              strokeWidth={1}
              strokeDasharray="4 3"
            />
          ) : null}
        </g>

        {/* Axes and labels */}
        <rect x={frame.left} y={frame.top} width={frame.width} height={frame.height} fill="none" stroke={C.frame} strokeWidth={1} />
        <g aria-hidden="true" fontSize={10.5} fill={C.label}>
          {isobarsFor(frame).map((p) => (
            <text key={p} x={frame.left - 5} y={transform.pressureToY(p) + 3.5} textAnchor="end">
              {p}
            </text>
          ))}
          <text x={frame.left - 5} y={bottom + 28} fontSize={9.5} textAnchor="end">
            hPa
          </text>
          {isotherms
            .filter((line) => line.bottomX !== null)
            .map((line) => (
              <text key={line.value} x={line.bottomX ?? 0} y={bottom + 14} textAnchor="middle">
                {Math.round(toDisplayTemperature(line.value, units.temperature))}
              </text>
            ))}
          <text x={right} y={bottom + 28} textAnchor="end" fontSize={9.5}>
            {units.temperature === 'C' ? '°C' : '°F'} (isotherms every 10 °C)
          </text>
          <text x={BARB_X} y={frame.top + 8} textAnchor="middle" fontSize={9.5}>
            kt
          </text>
        </g>

        {/* Wind barbs, in knots (WMO) */}
        <g aria-hidden="true">
          {barbLevels(levels, transform, frame.top, bottom).map(({ level, y, directionDeg, speedKt }) => {
            const shape = barbShape({ x: BARB_X, y }, directionDeg, speedKt, 26);
            return (
              <g key={level.pressureHpa}>
                {shape.calm ? <circle cx={BARB_X} cy={y} r={3} fill="none" stroke={C.barb} /> : null}
                <path d={shape.linePath} stroke={C.barb} strokeWidth={1.2} fill="none" strokeLinecap="round" />
                <path d={shape.pennantPath} fill={C.barb} />
              </g>
            );
          })}
          <line x1={BARB_X} x2={BARB_X} y1={frame.top + 14} y2={bottom} stroke={C.isobar} strokeWidth={0.8} />
        </g>

        {/* Surface points: draggable when the diagram edits the surface */}
        {surface ? (
          <g>
            {originalSurface ? (
              <g aria-hidden="true">
                <circle {...xy(transform.toPoint(surface.pressureHpa, originalSurface.temperatureC))} r={4} fill="#ffffff" stroke={C.temperature} strokeWidth={1.5} />
                {originalSurface.dewpointC !== null ? (
                  <circle {...xy(transform.toPoint(surface.pressureHpa, originalSurface.dewpointC))} r={4} fill="#ffffff" stroke={C.dewpoint} strokeWidth={1.5} />
                ) : null}
              </g>
            ) : null}
            {(
              [
                ['temperature', surface.temperatureC, C.temperature, 'Surface temperature'],
                ['dewpoint', surface.dewpointC, C.dewpoint, 'Surface dewpoint'],
              ] as const
            ).map(([handle, value, colour, label]) =>
              value === null ? null : (
                <circle
                  key={handle}
                  {...xy(transform.toPoint(surface.pressureHpa, value))}
                  r={onSurfaceChange ? 6.5 : 3.5}
                  fill={colour}
                  stroke="#ffffff"
                  strokeWidth={1.5}
                  style={onSurfaceChange ? { cursor: 'ew-resize' } : undefined}
                  {...(onSurfaceChange
                    ? {
                        role: 'slider',
                        tabIndex: 0,
                        'aria-label': `${label}: drag sideways or use the arrow keys`,
                        'aria-valuenow': round1(toDisplayTemperature(value, units.temperature)),
                        'aria-valuetext': temperatureText(value, units),
                        'aria-orientation': 'horizontal' as const,
                        onKeyDown: handleKeyDown(handle),
                        onPointerDown: (event: PointerEvent<SVGCircleElement>) => {
                          event.stopPropagation();
                          dragging.current = handle;
                          svgRef.current?.setPointerCapture?.(event.pointerId);
                        },
                      }
                    : { 'aria-hidden': true })}
                />
              ),
            )}
          </g>
        ) : null}

        {readout ? <Readout lines={readout} x={frame.left + 8} y={frame.top + 8} /> : null}
      </svg>
      <p id={hintId} className="sr-only">
        Use the up and down arrow keys to move a readout between levels; Escape hides it.
        {onSurfaceChange ? ' The surface temperature and dewpoint points can be moved with the left and right arrow keys.' : ''}
      </p>
      <p className="sr-only" aria-live="polite">
        {readout ? readout.join('; ') : ''}
      </p>
      <DiagramLegend />
    </figure>
  );
}


/** The static lines of the diagram; memoised so a what-if change does not re-render them. */
const DiagramBackground = memo(function DiagramBackground({ transform }: { transform: SkewT }) {
  const background = useMemo(() => backgroundPaths(transform), [transform]);
  const frame = transform.frame;
  const right = frame.left + frame.width;
  return (
    <g>
        {isobarsFor(frame).map((p) => (
          <line key={p} x1={frame.left} x2={right} y1={transform.pressureToY(p)} y2={transform.pressureToY(p)} stroke={C.isobar} strokeWidth={0.8} />
        ))}
        {background.isotherms.map((line) => (
          <path key={line.value} d={line.d} stroke={line.value === 0 ? C.isothermZero : C.isotherm} strokeWidth={line.value === 0 ? 1.2 : 0.8} fill="none" />
        ))}
        {background.dry.map((line) => (
          <path key={line.value} d={line.d} stroke={C.dryAdiabat} strokeWidth={0.8} strokeDasharray={DASHES.dryAdiabat} fill="none" opacity={0.75} />
        ))}
        {background.moist.map((line) => (
          <path key={line.value} d={line.d} stroke={C.pseudoAdiabat} strokeWidth={1.1} strokeDasharray={DASHES.pseudoAdiabat} fill="none" />
        ))}
        {background.mixing.map((line) => (
          <g key={line.value}>
            <path d={line.d} stroke={C.mixingRatio} strokeWidth={0.9} strokeDasharray={DASHES.mixingRatio} fill="none" />
            {line.label ? (
              <text x={line.label.x} y={line.label.y - 3} fontSize={9} fill={C.mixingRatio} textAnchor="middle">
                {line.value}
              </text>
            ) : null}
          </g>
        ))}
    </g>
  );
});

function xy(point: { x: number; y: number }): { cx: number; cy: number } {
  return { cx: point.x, cy: point.y };
}

function Readout({ lines, x, y }: { lines: string[]; x: number; y: number }) {
  const width = 208;
  return (
    <g aria-hidden="true" pointerEvents="none">
      <rect x={x} y={y} width={width} height={lines.length * 15 + 8} rx={4} fill="#ffffff" fillOpacity={0.94} stroke={C.frame} strokeWidth={0.8} />
      {lines.map((line, index) => (
        <text key={index} x={x + 8} y={y + 16 + index * 15} fontSize={11} fill="#172030" fontWeight={index === 0 ? 600 : 400} style={{ fontVariantNumeric: 'tabular-nums' }}>
          {line}
        </text>
      ))}
    </g>
  );
}

/** The readout text of a level. */
function readoutLines(levels: readonly SoundingLevel[], level: SoundingLevel, parcel: ParcelResult | null, key: ParcelKey, units: Units): string[] {
  const wind = levelWind(level);
  const parcelC = parcelTemperatureAt(parcel?.trace, level.pressureHpa);
  return [
    `${pressureText(level.pressureHpa, level.pressureHpa % 1 === 0 ? 0 : 1)} · ${heightText(heightAboveGround(levels, level), units)} AGL`,
    `Temperature ${temperatureText(level.temperatureC, units)}`,
    `Dewpoint ${level.dewpointC === null ? '—' : temperatureText(level.dewpointC, units)}`,
    `Wind ${wind ? `${String(Math.round(wind.directionDeg)).padStart(3, '0')}° ${speedText(wind.speedMs, units)}` : '—'}`,
    `Parcel (${PARCEL_LABELS[key].short}) ${Number.isFinite(parcelC) ? temperatureText(parcelC, units) : '—'}`,
  ];
}

interface Marker {
  name: string;
  label: string;
  x: number;
  y: number;
  /** Which side of the trace the label goes, so it stays inside the plot. */
  side: 'left' | 'right';
}

/** Rough width of a label at 10.5 px (about 0.6 em per character). */
const labelWidth = (text: string): number => text.length * 6.3 + 28;

function parcelMarkers(parcel: ParcelResult, transform: SkewT, units: Units): Marker[] {
  const items: [string, number | null, number | null][] = [
    ['LCL', parcel.lclPressure, parcel.lclHeight],
    ['LFC', parcel.lfcPressure, parcel.lfcHeight],
    ['EL', parcel.elPressure, parcel.elHeight],
  ];
  const { pressureTopHpa, pressureBottomHpa } = transform.frame;
  return items.flatMap(([name, pressure, height]) => {
    if (pressure === null || pressure < pressureTopHpa || pressure > pressureBottomHpa) return [];
    const temperature = parcelTemperatureAt(parcel.trace, pressure);
    const point = transform.toPoint(pressure, Number.isFinite(temperature) ? temperature : parcel.lclTemperature);
    const label = height === null ? name : `${name} ${heightText(height, units)}`;
    const fitsRight = point.x + labelWidth(label) <= transform.frame.left + transform.frame.width;
    return [{ name, label, x: point.x, y: point.y, side: fitsRight ? ('right' as const) : ('left' as const) }];
  });
}

/** Levels with wind, thinned so barbs are at least 16 px apart. */
function barbLevels(levels: readonly SoundingLevel[], transform: SkewT, top: number, bottom: number) {
  const result: { level: SoundingLevel; y: number; directionDeg: number; speedKt: number }[] = [];
  let lastY = Infinity;
  for (const level of levels) {
    const wind = levelWind(level);
    if (!wind) continue;
    const y = transform.pressureToY(level.pressureHpa);
    if (y > bottom || y < top + 14 || lastY - y < 16) continue;
    result.push({ level, y, directionDeg: wind.directionDeg, speedKt: metresPerSecondToKnots(wind.speedMs) });
    lastY = y;
  }
  return result;
}

interface BackgroundLine {
  value: number;
  d: string;
}

function isothermLines(transform: SkewT): (BackgroundLine & { bottomX: number | null })[] {
  const { pressureBottomHpa: bottom, pressureTopHpa: top, temperatureLeftC, left, width } = transform.frame;
  const isotherms: (BackgroundLine & { bottomX: number | null })[] = [];
  const topLeftC = transform.fromPoint({ x: left, y: transform.pressureToY(top) }).temperatureC;
  for (let t = Math.floor(topLeftC / 10) * 10; t <= temperatureLeftC + 200; t += 10) {
    const a = transform.toPoint(bottom, t);
    const b = transform.toPoint(top, t);
    if (a.x > left + width) break;
    isotherms.push({ value: t, d: `M${a.x.toFixed(1)},${a.y.toFixed(1)}L${b.x.toFixed(1)},${b.y.toFixed(1)}`, bottomX: a.x >= left && a.x <= left + width ? a.x : null });
  }
  return isotherms;
}

function backgroundPaths(transform: SkewT) {
  const { pressureBottomHpa: bottom, pressureTopHpa: top } = transform.frame;
  const toPath = (points: { pressureHpa: number; temperatureC: number }[]) =>
    pathThrough(points.map((point) => transform.toPoint(point.pressureHpa, point.temperatureC)));
  const isotherms = isothermLines(transform);
  const moistTop = Math.max(top, 200);
  const mixingTop = Math.max(top, 600);
  const mixing = mixingRatioLines(MIXING_RATIOS_G_PER_KG, bottom, mixingTop).map((curve) => {
    const last = curve.points[curve.points.length - 1];
    const label = last ? transform.toPoint(last.pressureHpa, last.temperatureC) : null;
    return { value: curve.value, d: toPath(curve.points), label };
  });
  return {
    isotherms,
    dry: dryAdiabats(DRY_ADIABAT_THETAS_C, bottom, top).map((curve) => ({ value: curve.value, d: toPath(curve.points) })),
    moist: pseudoAdiabats(PSEUDO_ADIABAT_THETA_WS_C, bottom, moistTop).map((curve) => ({ value: curve.value, d: toPath(curve.points) })),
    mixing,
  };
}

/** The legend under the diagram. */
function DiagramLegend() {
  const items: { label: string; stroke: string; dash?: string; width?: number; fill?: string }[] = [
    { label: 'Temperature', stroke: C.temperature, width: 2.4 },
    { label: 'Dewpoint', stroke: C.dewpoint, width: 2.4 },
    { label: 'Virtual temperature', stroke: C.temperature, dash: '2 2', width: 1 },
    { label: 'Parcel (virtual temperature)', stroke: C.parcel, width: 1.9 },
    { label: 'Other parcels', stroke: C.parcel, dash: DASHES.otherParcel, width: 1.1 },
    { label: 'Positive area (CAPE)', stroke: 'none', fill: C.positiveArea },
    { label: 'Negative area (CIN)', stroke: 'none', fill: C.negativeArea },
    { label: 'Isotherm', stroke: C.isotherm, width: 1 },
    { label: 'Dry adiabat', stroke: C.dryAdiabat, dash: DASHES.dryAdiabat, width: 1 },
    { label: 'Pseudo-adiabat', stroke: C.pseudoAdiabat, dash: DASHES.pseudoAdiabat, width: 1.3 },
    { label: 'Mixing ratio (g/kg)', stroke: C.mixingRatio, dash: DASHES.mixingRatio, width: 1 },
  ];
  return (
    <figcaption className="mt-2">
      <ul className="flex flex-wrap gap-x-4 gap-y-1 text-[12px] text-ink-muted" aria-label="Legend">
        {items.map((item) => (
          <li key={item.label} className="inline-flex items-center gap-1.5">
            <svg width={24} height={10} aria-hidden="true">
              {item.fill ? (
                <rect x={0} y={1} width={24} height={8} fill={item.fill} fillOpacity={0.45} />
              ) : (
                <line x1={0} x2={24} y1={5} y2={5} stroke={item.stroke} strokeWidth={item.width ?? 1} strokeDasharray={item.dash} />
              )}
            </svg>
            {item.label}
          </li>
        ))}
        <li>Wind barbs in knots: pennant 50, barb 10, half barb 5</li>
      </ul>
    </figcaption>
  );
}
