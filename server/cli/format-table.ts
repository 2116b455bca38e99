import type { ParcelResult, ParsedSounding, SoundingAnalysis } from '../../shared/sounding';

/** A number with fixed decimals, or "—" for null. */
function show(value: number | null | undefined, digits = 0): string {
  if (value === null || value === undefined) return '—';
  const text = value.toFixed(digits);
  return Number(text) === 0 ? (0).toFixed(digits) : text; // never print "-0"
}

function section(title: string, rows: [string, string][]): string {
  const width = Math.max(...rows.map(([label]) => label.length));
  const body = rows.map(([label, value]) => `  ${label.padEnd(width)}  ${value}`).join('\n');
  return title ? `${title}\n${body}\n` : `${body}\n`;
}

function parcelTable(title: string, header: string[], row: (parcel: ParcelResult) => string[], analysis: SoundingAnalysis): string {
  const parcels: [string, ParcelResult][] = [
    ['surface-based', analysis.surfaceBased],
    ['mixed-layer', analysis.mixedLayer],
    [`most-unstable (${show(analysis.mostUnstable.parcelPressure)} hPa)`, analysis.mostUnstable],
  ];
  const cells = [['parcel', ...header], ...parcels.map(([name, parcel]) => [name, ...row(parcel)])];
  const widths = (cells[0] ?? []).map((_, column) => Math.max(...cells.map((line) => (line[column] ?? '').length)));
  const lines = cells.map((line) => `  ${line.map((cell, column) => (column === 0 ? cell.padEnd(widths[column] ?? 0) : cell.padStart(widths[column] ?? 0))).join('  ')}`);
  return `${title}\n${lines.join('\n')}\n`;
}

/**
 * The analysis as a readable text table, grouped as instability, moisture, cloud base,
 * kinematics and composites. Units are in the column headings.
 */
export function formatAnalysisTable(sounding: ParsedSounding, analysis: SoundingAnalysis): string {
  const m = sounding.metadata;
  const e = analysis.environment;
  const k = analysis.kinematics;
  const c = analysis.composites;
  const motion = (vector: { u: number; v: number } | null): string => {
    if (!vector) return '—';
    const speed = Math.hypot(vector.u, vector.v);
    const direction = ((Math.atan2(-vector.u, -vector.v) * 180) / Math.PI + 360) % 360;
    return `${direction.toFixed(0)}° at ${speed.toFixed(1)} m/s (u ${vector.u.toFixed(1)}, v ${vector.v.toFixed(1)})`;
  };
  const parts = [
    `${m.station} ${m.name} — valid ${m.validTime} (${m.source}), ${sounding.levels.length} levels, engine ${analysis.engineVersion}\n`,
    parcelTable(
      'INSTABILITY',
      ['CAPE J/kg', 'CIN J/kg', '0-3km CAPE', 'LI K', 'LFC hPa', 'LFC m AGL', 'EL hPa', 'EL m AGL'],
      (p) => [show(p.cape), show(p.cin), show(p.cape0to3km), show(p.liftedIndex, 1), show(p.lfcPressure), show(p.lfcHeight), show(p.elPressure), show(p.elHeight)],
      analysis,
    ),
    section('', [
      ['downdraft CAPE', `${show(e.downdraftCape)} J/kg (from ${show(e.downdraftParcelPressure)} hPa)`],
      ['lapse rate 0-3 km', `${show(e.lapseRate0to3km, 1)} K/km`],
      ['lapse rate 700-500 hPa', `${show(e.lapseRate700to500hPa, 1)} K/km`],
    ]),
    section('MOISTURE', [
      ['precipitable water', `${show(e.precipitableWater, 1)} mm (to ${show(e.moistureTopPressure)} hPa)`],
      ['surface temperature / dewpoint', `${show(e.surfaceTemperatureC, 1)} / ${show(e.surfaceDewpointC, 1)} °C`],
      ['surface mixing ratio', `${show(e.surfaceMixingRatio, 1)} g/kg`],
      ['mean mixing ratio lowest 100 hPa', `${show(e.meanMixingRatio0to100hPa, 1)} g/kg`],
      ['surface dewpoint reduced to 1000 hPa', `${show(e.surfaceDewpointAt1000hPaC, 1)} °C`],
      ['freezing level', `${show(e.freezingLevelHeight)} m AGL`],
      ['wet-bulb zero', `${show(e.wetBulbZeroHeight)} m AGL`],
    ]),
    parcelTable(
      'CLOUD BASE (LCL)',
      ['LCL hPa', 'LCL m AGL', 'LCL °C'],
      (p) => [show(p.lclPressure), show(p.lclHeight), show(p.lclTemperature, 1)],
      analysis,
    ),
    section('KINEMATICS', [
      ['bulk shear 0-1 / 0-3 / 0-6 km', `${show(k.bulkShear0to1km, 1)} / ${show(k.bulkShear0to3km, 1)} / ${show(k.bulkShear0to6km, 1)} m/s`],
      ['mean wind 0-6 km', motion(k.meanWind0to6km)],
      ['Bunkers right mover', motion(k.stormMotionRight)],
      ['Bunkers left mover', motion(k.stormMotionLeft)],
      ['SRH 0-1 / 0-3 km (right mover)', `${show(k.srh0to1km)} / ${show(k.srh0to3km)} m²/s²`],
      [
        'effective inflow layer',
        k.effectiveInflowLayer
          ? `${show(k.effectiveInflowLayer.bottomPressure)}-${show(k.effectiveInflowLayer.topPressure)} hPa (${show(k.effectiveInflowLayer.bottomHeight)}-${show(k.effectiveInflowLayer.topHeight)} m AGL)`
          : 'none',
      ],
      ['effective SRH', `${show(k.effectiveSrh)} m²/s²`],
      ['effective bulk shear', `${show(k.effectiveBulkShear, 1)} m/s`],
    ]),
    section('COMPOSITES', [
      ['supercell composite (effective)', show(c.supercellComposite, 1)],
      ['supercell composite (fixed layer)', show(c.supercellCompositeFixedLayer, 1)],
      ['significant tornado (effective)', show(c.significantTornado, 1)],
      ['significant tornado (fixed layer)', show(c.significantTornadoFixedLayer, 1)],
    ]),
  ];
  // The instability extras follow the parcel table without a blank line.
  return `${parts[0]}\n${parts[1]}${parts.slice(2).join('\n')}`;
}
