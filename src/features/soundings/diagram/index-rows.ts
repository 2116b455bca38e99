import type { Units } from '../../../../shared/contracts/users';
import type { IngredientsAnalysis } from '../../../../shared/sounding/ingredients';
import { windDirectionAndSpeed, type ParcelResult, type SoundingAnalysis, type WindVector } from '../../../../shared/sounding';
import { MISSING, energyText, formatNumber, heightText, pressureText, speedText, temperatureText, withUnit } from './format';

/**
 * The rows of the index panel, grouped as instability, moisture, cloud base, kinematics,
 * composites and the hazard ingredients (tornado, hail, damaging wind, flash flooding), already formatted in the person's units. A missing value is "—" with a reason
 * for its title. Pure: the component only renders these rows.
 */
export interface IndexRow {
  label: string;
  /** What the label stands for, for the title and screen readers. */
  description: string;
  value: string;
  /** Why the value is missing; null when there is a value. */
  missingReason: string | null;
}

export interface IndexGroup {
  title: 'Instability' | 'Moisture' | 'Cloud base' | 'Kinematics' | 'Composites' | 'Hazard ingredients';
  rows: IndexRow[];
}

const NO_LFC = 'Does not exist (no LFC): the parcel never becomes warmer than its surroundings.';
const NO_EL = 'Does not exist (no LFC, or the parcel is still buoyant at the top of the data).';
const NO_LI = 'Cannot be computed: the parcel starts above 500 hPa or the data stop below it.';
const NO_LCL = 'Does not exist within the data (the LCL is above the top of the sounding).';
const NO_WIND = 'Cannot be computed: the winds do not reach this height.';
const NO_INGREDIENT = 'Cannot be computed: an ingredient (winds, LCL or effective layer) is missing.';
const NO_DATA = 'Cannot be computed from these data.';
const NO_850 = 'Does not exist here: 850 hPa is below the ground, or the data stop below 500 hPa.';
const NO_HAIL_ZONE = 'Cannot be computed: the data do not reach −30 °C.';
const NO_CLOUD_LAYER = 'Cannot be computed: the winds do not reach 300 hPa.';
const NO_ANGLE = 'Cannot be computed: no winds to 500 m, no storm motion, or no shear or inflow to give a direction.';

function row(label: string, description: string, value: number | null | undefined, format: (v: number) => string, missingReason: string): IndexRow {
  if (value === null || value === undefined || !Number.isFinite(value)) return { label, description, value: MISSING, missingReason };
  return { label, description, value: format(value), missingReason: null };
}

function motion(vector: WindVector | null): number | null {
  return vector ? windDirectionAndSpeed(vector.u, vector.v).speed : null;
}

const speedOf = (vector: WindVector | null | undefined): number | null => motion(vector ?? null);

function motionText(vector: WindVector, units: Units): string {
  const { directionDeg, speed } = windDirectionAndSpeed(vector.u, vector.v);
  return `${String(Math.round(directionDeg) % 360).padStart(3, '0')}° ${speedText(speed, units)}`;
}

const lapse = (value: number): string => withUnit(value, 1, 'K/km');
const helicity = (value: number): string => withUnit(value, 0, 'm²/s²');
const dimensionless = (value: number): string => formatNumber(value, 1);

export interface ParcelColumn {
  prefix: string;
  name: string;
  parcel: ParcelResult;
}

/** The rows of every group. `chosen` adds the rows of a parcel lifted from a chosen level. */
export function indexGroups(analysis: SoundingAnalysis, units: Units, chosen: ParcelResult | null = null): IndexGroup[] {
  const parcels: ParcelColumn[] = [
    { prefix: 'SB', name: 'surface-based', parcel: analysis.surfaceBased },
    { prefix: 'ML', name: 'mixed-layer', parcel: analysis.mixedLayer },
    { prefix: 'MU', name: 'most-unstable', parcel: analysis.mostUnstable },
    ...(chosen ? [{ prefix: `${Math.round(chosen.parcelPressure)} hPa `, name: `lifted from ${Math.round(chosen.parcelPressure)} hPa`, parcel: chosen }] : []),
  ];
  const env = analysis.environment;
  const k = analysis.kinematics;
  const c = analysis.composites;
  // Absent from analyses made before the engine computed the hazard ingredients.
  const ing: Partial<IngredientsAnalysis> | undefined = analysis.ingredients;
  const h = (v: number) => heightText(v, units);
  const t = (v: number) => temperatureText(v, units);
  const s = (v: number) => speedText(v, units);

  const instability: IndexRow[] = [
    ...parcels.map((p) => row(`${p.prefix}CAPE`, `CAPE of the ${p.name} parcel`, p.parcel.cape, energyText, NO_DATA)),
    ...parcels.map((p) => row(`${p.prefix}CIN`, `CIN of the ${p.name} parcel`, p.parcel.cin, energyText, NO_DATA)),
    ...parcels.map((p) => row(`${p.prefix}LI`, `Lifted index of the ${p.name} parcel at 500 hPa`, p.parcel.liftedIndex, (v) => withUnit(v, 1, 'K'), NO_LI)),
    row('ML 0–3 km CAPE', 'CAPE of the mixed-layer parcel below 3 km', analysis.mixedLayer.cape0to3km, energyText, NO_DATA),
    ...parcels.map((p) => row(`${p.prefix} EL`, `Equilibrium level of the ${p.name} parcel (above ground)`, p.parcel.elHeight, h, NO_EL)),
    row('MU parcel', 'Pressure the most-unstable parcel starts from', analysis.mostUnstable.parcelPressure, (v) => pressureText(v), NO_DATA),
    row('Lapse rate 0–3 km', 'Temperature lapse rate, surface to 3 km', env.lapseRate0to3km, lapse, NO_DATA),
    row('Lapse rate 3–6 km', 'Temperature lapse rate, 3 to 6 km above ground', ing?.lapseRate3to6km, lapse, NO_DATA),
    row('Lapse rate 850–500 hPa', 'Temperature lapse rate between 850 and 500 hPa', ing?.lapseRate850to500hPa, lapse, NO_850),
    row('Lapse rate 700–500 hPa', 'Temperature lapse rate between 700 and 500 hPa', env.lapseRate700to500hPa, lapse, NO_DATA),
    row('DCAPE', 'Downdraft CAPE', env.downdraftCape, energyText, NO_DATA),
    row('Freezing level', 'Height of the 0 °C level above ground', env.freezingLevelHeight, h, NO_DATA),
  ];
  const moisture: IndexRow[] = [
    row('Surface dewpoint', 'Dewpoint at the lowest level', env.surfaceDewpointC, t, NO_DATA),
    row('Surface mixing ratio', 'Mixing ratio at the lowest level', env.surfaceMixingRatio, (v) => withUnit(v, 1, 'g/kg'), NO_DATA),
    row('Mean mixing ratio 0–100 hPa', 'Mean mixing ratio of the lowest 100 hPa', env.meanMixingRatio0to100hPa, (v) => withUnit(v, 1, 'g/kg'), NO_DATA),
    row('Precipitable water', 'Water in the column if all vapour condensed', env.precipitableWater, (v) => withUnit(v, 1, 'mm'), NO_DATA),
    row('Wet-bulb zero', 'Height of the 0 °C wet-bulb level above ground', env.wetBulbZeroHeight, h, NO_DATA),
  ];
  const cloudBase: IndexRow[] = [
    ...parcels.map((p) => row(`${p.prefix} LCL`, `Lifted condensation level of the ${p.name} parcel (above ground)`, p.parcel.lclHeight, h, NO_LCL)),
    row('ML LCL pressure', 'Pressure of the mixed-layer LCL', analysis.mixedLayer.lclPressure, (v) => pressureText(v), NO_DATA),
    row('ML LCL temperature', 'Temperature at the mixed-layer LCL', analysis.mixedLayer.lclTemperature, t, NO_DATA),
    ...parcels.map((p) => row(`${p.prefix} LFC`, `Level of free convection of the ${p.name} parcel (above ground)`, p.parcel.lfcHeight, h, NO_LFC)),
  ];
  const kinematics: IndexRow[] = [
    row('Shear 0–1 km', 'Bulk wind difference, surface to 1 km', k.bulkShear0to1km, s, NO_WIND),
    row('Shear 0–3 km', 'Bulk wind difference, surface to 3 km', k.bulkShear0to3km, s, NO_WIND),
    row('Shear 0–6 km', 'Bulk wind difference, surface to 6 km', k.bulkShear0to6km, s, NO_WIND),
    row('Effective shear', 'Bulk wind difference of the effective layer', k.effectiveBulkShear, s, NO_INGREDIENT),
    row('SRH 0–1 km', 'Storm-relative helicity, surface to 1 km (right mover)', k.srh0to1km, helicity, NO_WIND),
    row('SRH 0–3 km', 'Storm-relative helicity, surface to 3 km (right mover)', k.srh0to3km, helicity, NO_WIND),
    row('Effective SRH', 'Storm-relative helicity of the effective inflow layer', k.effectiveSrh, helicity, NO_INGREDIENT),
    {
      ...row('Bunkers right mover', 'Right-moving supercell motion (Bunkers)', motion(k.stormMotionRight), s, NO_WIND),
      ...(k.stormMotionRight ? { value: motionText(k.stormMotionRight, units) } : {}),
    },
    {
      ...row('Bunkers left mover', 'Left-moving supercell motion (Bunkers)', motion(k.stormMotionLeft), s, NO_WIND),
      ...(k.stormMotionLeft ? { value: motionText(k.stormMotionLeft, units) } : {}),
    },
    row('BRN shear', 'Bulk Richardson number shear', k.brnShear, helicity, NO_WIND),
  ];
  const composites: IndexRow[] = [
    row('SCP', 'Supercell composite parameter (effective layer)', c.supercellComposite, dimensionless, NO_INGREDIENT),
    row('SCP fixed layer', 'Supercell composite parameter (fixed layer)', c.supercellCompositeFixedLayer, dimensionless, NO_INGREDIENT),
    row('STP', 'Significant tornado parameter (effective layer)', c.significantTornado, dimensionless, NO_INGREDIENT),
    row('STP fixed layer', 'Significant tornado parameter (fixed layer)', c.significantTornadoFixedLayer, dimensionless, NO_INGREDIENT),
  ];
  const hazards: IndexRow[] = [
    row('SRH 0–500 m', 'Tornado: storm-relative helicity, surface to 500 m (cyclonic deviant mover; Coffer et al. 2019)', ing?.srh0to500m, helicity, NO_WIND),
    row('Critical angle', 'Tornado: angle between the surface storm-relative inflow and the 0–500 m shear; 90° is purely streamwise (Esterheld and Giuliano 2008)', ing?.criticalAngleDeg, (v) => withUnit(v, 0, '°'), NO_ANGLE),
    row('ML LCL–LFC gap', 'Tornado: height of the mixed-layer LFC above its LCL', ing?.mlLclLfcGap, h, NO_LFC),
    row('Hail-zone CAPE', 'Hail: most-unstable CAPE between the −10 °C and −30 °C levels (Johnson and Sugden 2014)', ing?.muCapeHailZone, energyText, NO_HAIL_ZONE),
    row('−10 °C level', 'Hail: height of the −10 °C level above ground', ing?.minus10CHeight, h, NO_DATA),
    row('−30 °C level', 'Hail: height of the −30 °C level above ground', ing?.minus30CHeight, h, NO_HAIL_ZONE),
    row('Shear 0–8 km', 'Hail and supercells: bulk wind difference, surface to 8 km', ing?.bulkShear0to8km, s, NO_WIND),
    row('Mean wind 0–6 km', 'Damaging wind: pressure-weighted mean wind, surface to 6 km', ing?.meanWind0to6kmSpeed, s, NO_WIND),
    {
      ...row('Corfidi upwind', 'Flash flooding: upwind-propagation vector, 850–300 hPa mean wind minus the low-level jet (Corfidi 2003)', speedOf(ing?.corfidiUpwind), s, NO_CLOUD_LAYER),
      ...(ing?.corfidiUpwind ? { value: motionText(ing.corfidiUpwind, units) } : {}),
    },
    {
      ...row('Corfidi downwind', 'Flash flooding: downwind-propagation vector, 850–300 hPa mean wind plus the upwind vector (Corfidi 2003)', speedOf(ing?.corfidiDownwind), s, NO_CLOUD_LAYER),
      ...(ing?.corfidiDownwind ? { value: motionText(ing.corfidiDownwind, units) } : {}),
    },
    row('Warm-cloud depth', 'Flash flooding: mixed-layer LCL to the freezing level (Doswell, Brooks and Maddox 1996)', ing?.warmCloudDepth, h, NO_LCL),
  ];
  return [
    { title: 'Instability', rows: instability },
    { title: 'Moisture', rows: moisture },
    { title: 'Cloud base', rows: cloudBase },
    { title: 'Kinematics', rows: kinematics },
    { title: 'Composites', rows: composites },
    { title: 'Hazard ingredients', rows: hazards },
  ];
}
