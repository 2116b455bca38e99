/**
 * Invented demo soundings for the Meridian Valley demo office. NOTHING HERE IS OBSERVED DATA:
 * every profile is built from smooth, made-up fields of one invented spring day, plus a small
 * seeded perturbation, so the demo is the same on every machine.
 *
 * The invented day (x: 0 west … 1 east, y: 0 south … 1 north of the office region):
 * - A surface low near the western edge drifts north-east through the day. A warm front runs
 *   east-south-east from it; a dryline trails south from it.
 * - Warm sector (south of the front, east of the dryline): surface dewpoints 17–21 °C, richest
 *   along a moist tongue that points from the southern valleys north-west toward the low; a
 *   mixed layer about 1.3 km deep in the afternoon under a capping inversion, and above it an
 *   elevated mixed layer with steep mid-level lapse rates (steepest in the west).
 * - The cap is strongest in the east and erodes from the west through the day.
 * - North of the front: a cool, stable surface layer under a frontal inversion, with the warm
 *   sector's moist air riding above it (elevated instability: MUCAPE but little MLCAPE).
 * - West of the dryline: hot, dry and deeply mixed (high cloud base, large downdraft CAPE).
 * - Winds: surface winds back to east-south-east along and north of the front under a
 *   south-south-westerly low-level jet (strongest just south of the front and in the evening),
 *   so low-level helicity peaks in a corridor along the warm front; a west-south-westerly
 *   mid-level jet crosses the middle of the region and drifts north.
 * - South-eastern lowlands: a deep moist column (high precipitable water, moist mid-levels),
 *   weaker flow aloft and a low-level jet nearly parallel to the cloud-layer wind, so new cells
 *   keep forming upwind: slow system motion.
 * Heights are left out on purpose: the engine fills them with the hypsometric equation.
 */

export interface DemoSoundingInput {
  metadata: {
    station: string;
    name: string;
    latitude: number;
    longitude: number;
    elevationM: number;
    validTime: string;
    source: 'observed' | 'model';
  };
  levels: { pressureHpa: number; temperatureC: number; dewpointC: number; uMs: number; vMs: number }[];
}

/** Invented station names (places that do not exist as weather stations). */
const stationNames = [
  'Cedar Ford', 'Willow Bend', 'Harrow Flats', 'Pike Landing', 'Osage Mill', 'Briar Hollow', 'Fenwick', 'Larkspur',
  'Stone Creek', 'Marlow Bluff', 'Quill Prairie', 'Tanner Gap', 'Ashby Crossing', 'Juniper Vale', 'Redmoor', 'Kestrel Point',
  'Elm Furrow', 'Hollis Ferry', 'Barrow Ridge', 'Gentry Plain', 'Wexley', 'Copper Run', 'Dunmore Fields', 'Sable Lake',
  'Orchard Hill', 'Thistle Bank', 'Verden', 'Millrace', 'Yarrow', 'Northcote', 'Fallow Reach', 'Heron Shoals',
  'Lindqvist Mound', 'Pell Crossing', 'Saltash Prairie', 'Oxbow Lea', 'Greywater', 'Maddox Glen', 'Tillery', 'Cobble Fork',
] as const;

/** Deterministic pseudo-random numbers (mulberry32), so the demo is the same on every machine. */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** The demo office region (degrees). */
export const demoRegion = { west: -96.5, south: 35.5, east: -87.5, north: 41.5 } as const;

/** Longitude and latitude of a point of the unit square over the region. */
export function demoLonLat(x: number, y: number): [number, number] {
  return [demoRegion.west + x * (demoRegion.east - demoRegion.west), demoRegion.south + y * (demoRegion.north - demoRegion.south)];
}

const sigmoid = (s: number) => 1 / (1 + Math.exp(-s));
const clamp = (v: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, v));
const lerp = (a: number, b: number, t: number) => a + (b - a) * t;
const KAPPA = 0.2857; // Rd/cp
const ZERO_C_K = 273.15;

/** Wind vector (u, v) in m/s blowing FROM `directionDeg` at `speedMs`. */
function wind(directionDeg: number, speedMs: number): [number, number] {
  const r = (directionDeg * Math.PI) / 180;
  return [-speedMs * Math.sin(r), -speedMs * Math.cos(r)];
}
const mixVector = (a: [number, number], b: [number, number], t: number): [number, number] => [lerp(a[0], b[0], t), lerp(a[1], b[1], t)];

/** Saturation vapour pressure over water, hPa (Bolton 1980 eq. 10): used only to build invented profiles. */
const saturationHpa = (tC: number) => 6.112 * Math.exp((17.67 * tC) / (tC + 243.5));
const mixingRatioOf = (tdC: number, pHpa: number) => (0.622 * saturationHpa(tdC)) / (pHpa - saturationHpa(tdC));
function dewpointOf(mixingRatio: number, pHpa: number): number {
  const ln = Math.log((mixingRatio * pHpa) / (0.622 + mixingRatio) / 6.112);
  return (243.5 * ln) / (17.67 - ln);
}

/** The day's surface features at a cycle (0: 12 UTC, 1: 18 UTC, 2: 00 UTC next day). */
export function demoFeatures(cycle: number) {
  const lowX = 0.1 + 0.05 * cycle;
  const lowY = 0.64 + 0.03 * cycle;
  return {
    lowX,
    lowY,
    /** Latitude (unit square) of the warm front at x. */
    warmFrontY: (x: number) => lowY - 0.2 * (x - lowX),
    /** Longitude (unit square) of the dryline at y. */
    drylineX: (y: number) => lowX + 0.04 + 0.14 * Math.max(0, lowY - y),
    /** Latitude (unit square) of the mid-level jet axis. */
    jetY: 0.5 + 0.04 * cycle,
  };
}

/** The invented fields at one place and cycle that the profile is built from. */
export function demoFieldsAt(x: number, y: number, cycle: number) {
  const f = demoFeatures(cycle);
  const northOfFront = y - f.warmFrontY(x); // > 0 on the cold side
  const eastOfDryline = x - f.drylineX(y); // > 0 on the moist side
  const warm = sigmoid(-northOfFront / 0.025);
  const moist = sigmoid(eastOfDryline / 0.02);
  const tongue = Math.exp(-(((x - (0.62 - 0.55 * y)) / 0.28) ** 2));
  const lowlands = sigmoid((x - 0.55) / 0.07) * sigmoid((0.38 - y) / 0.07); // deep moisture, weak flow
  const nearFront = Math.exp(-((northOfFront / 0.07) ** 2));
  const diurnal = [-6, 0, -1.5][cycle] ?? 0;
  // Warm-sector air (at the surface south of the front, above the frontal inversion north of it).
  const warmT = 26 + 3 * (0.5 - y) + diurnal - 2.5 * nearFront;
  const warmTd = Math.min(warmT - 2.5, 16 + 3.5 * tongue + 2 * lowlands - 0.5 * nearFront - (cycle === 0 ? 1 : 0));
  const coldT = 15 + 2 * (1 - y) + 0.5 * diurnal;
  const coldTd = 10 + (1 - y);
  const dryT = 30 - 8 * (1 - warm) + diurnal;
  const dryTd = 3 + 2 * eastOfDryline;
  return {
    northOfFront,
    eastOfDryline,
    warm,
    moist,
    lowlands,
    nearFront,
    warmT,
    warmTd,
    coldT,
    coldTd,
    dryT,
    dryTd: Math.min(dryTd, 8),
    /** Depth of the cool layer under the frontal inversion, hPa (0 in the warm sector). */
    coldDepthHpa: moist * clamp(450 * (northOfFront + 0.03), 0, 150),
    /** Depth of the well-mixed boundary layer, hPa. */
    mixedDepthHpa: lerp(300 + 30 * (cycle === 1 ? 1 : 0), [70, 105, 115][cycle] ?? 105, moist),
    /** Strength of the capping inversion, K over 20 hPa: strongest in the east, eroding from the west. */
    capK: moist * (1 - 0.75 * lowlands) * clamp(5.5 * (x - 0.35) + 2.2 - 1.3 * cycle, 0.2, 6),
    /** Lapse rate of the elevated mixed layer up to 500 hPa, K/km (steepest in the west). */
    emlLapseKkm: 8.4 - 1.7 * x - 0.6 * lowlands - 0.5 * nearFront,
    /** Dewpoint depression above the boundary layer, K (dry in the west, moist in the lowlands and near the front). */
    midDepressionK: 16 + 6 * (1 - x) - 11 * lowlands - 7 * nearFront * moist,
    surfaceWind: mixVector(mixVector(wind(105, 7), wind(175, 8), sigmoid(-(northOfFront + 0.04) / 0.025)), wind(240, 9), 1 - moist),
    lowJet: mixVector(
      wind(205 + 15 * lowlands, (12 + 10.5 * Math.exp(-(((northOfFront + 0.07) / 0.12) ** 2)) * Math.exp(-(((x - 0.3) / 0.5) ** 2))) * ([0.8, 1, 1.2][cycle] ?? 1)),
      wind(245, 14),
      1 - moist,
    ),
    midJet: wind(245, 17 + 10 * Math.exp(-(((y - f.jetY) / 0.2) ** 2))),
  };
}

/**
 * One profile at a place and cycle: a mixed layer, a capping inversion, an elevated mixed
 * layer, a troposphere at 7 K/km and an isothermal stratosphere; a frontal inversion over cool
 * air north of the front; winds interpolated between a surface wind, a low-level jet near
 * 1.5 km, a mid-level jet near 6 km and the jet stream near 10 km.
 */
function profileAt(x: number, y: number, cycle: number, jitter: () => number): { elevationM: number; levels: DemoSoundingInput['levels'] } {
  const f = demoFieldsAt(x, y, cycle);
  const elevationM = Math.round(380 - 260 * x + 40 * Math.sin(6 * y) + 15 * jitter());
  const surfacePressure = Math.round(1013.25 * Math.exp(-elevationM / 8400) * 10) / 10;
  const noise = 0.6 * jitter();
  // Surface air of the warm sector, blended toward the dry air west of the dryline.
  const airT = lerp(f.dryT, f.warmT, f.moist) + noise;
  const airTd = Math.min(airT - 2, lerp(f.dryTd, f.warmTd, f.moist) + 0.4 * jitter());
  const theta = (airT + ZERO_C_K) * (1000 / surfacePressure) ** KAPPA;
  const mixingRatio = mixingRatioOf(airTd, surfacePressure);
  // A cool layer only where it is deeper than a level or so (at and north of the front).
  const coldTop = f.coldDepthHpa >= 8 ? surfacePressure - f.coldDepthHpa : surfacePressure + 1;
  const coldT = f.coldT + noise;
  const coldTd = Math.min(coldT - 1, f.coldTd);
  const mixedTop = Math.min(surfacePressure - f.mixedDepthHpa, coldTop - 60);
  const capTop = mixedTop - 20;

  const levels: DemoSoundingInput['levels'] = [];
  let heightM = 0;
  let previous: { p: number; t: number } | null = null;
  let envT = airT; // the warm-air profile (dry adiabat, cap, EML, troposphere)
  for (let p = surfacePressure; p >= 100; p -= p > 500 ? 10 : 15) {
    const pressure = Math.round(p * 10) / 10;
    if (previous) heightM += 29.27 * (previous.t + ZERO_C_K) * Math.log(previous.p / pressure);
    if (pressure >= mixedTop) envT = theta * (pressure / 1000) ** KAPPA - ZERO_C_K;
    else if (pressure >= capTop) envT += (f.capK * ((previous?.p ?? pressure) - pressure)) / 20;
    else if (previous) {
      const dz = 29.27 * (envT + ZERO_C_K) * Math.log(previous.p / pressure);
      // A stable layer just above the inversion, then the elevated mixed layer.
      const lapse = pressure > capTop - 30 ? 5.5 : pressure > 500 ? f.emlLapseKkm : pressure > 230 ? 7.2 : 0;
      envT = Math.max(envT - (lapse * dz) / 1000, pressure < 230 ? -58 : -80);
    }
    let temperature = envT;
    let dewpoint: number;
    if (pressure > coldTop) {
      temperature = coldT - 6 * (heightM / 1000);
      dewpoint = Math.min(temperature - 0.5, coldTd - 1.5 * (heightM / 1000));
    } else if (pressure >= mixedTop) {
      const fraction = (surfacePressure - pressure) / Math.max(1, surfacePressure - mixedTop);
      dewpoint = dewpointOf(mixingRatio * (1 - 0.08 * fraction), pressure);
    } else {
      const depression = f.midDepressionK + (pressure < 350 ? 10 : 0) + 3 * Math.sin(pressure / 45);
      dewpoint = temperature - Math.max(2, depression);
    }
    dewpoint = Math.min(dewpoint, temperature);
    previous = { p: pressure, t: temperature };

    // Winds: linear in height between the anchors (u, v), with a little noise.
    const anchors: [number, [number, number]][] = [
      [0, f.surfaceWind],
      // Along the front the jet reaches down to a few hundred metres: a sharp low-level turn.
      [500, mixVector(f.surfaceWind, f.lowJet, 0.4 + 0.4 * f.nearFront)],
      [1500, f.lowJet],
      [6000, f.midJet],
      [10500, [f.midJet[0] * 1.45 + 3, f.midJet[1] * 1.45 + 1]],
      [16000, [f.midJet[0] * 0.7, f.midJet[1] * 0.7]],
    ];
    let u = anchors[anchors.length - 1]?.[1][0] ?? 0;
    let v = anchors[anchors.length - 1]?.[1][1] ?? 0;
    for (let i = 0; i + 1 < anchors.length; i++) {
      const [z0, w0] = anchors[i] ?? [0, [0, 0]];
      const [z1, w1] = anchors[i + 1] ?? [0, [0, 0]];
      if (heightM <= z1) {
        const t = clamp((heightM - z0) / (z1 - z0), 0, 1);
        u = lerp(w0[0], w1[0], t);
        v = lerp(w0[1], w1[1], t);
        break;
      }
    }
    levels.push({
      pressureHpa: pressure,
      temperatureC: Math.round(temperature * 10) / 10,
      dewpointC: Math.round(dewpoint * 10) / 10,
      uMs: Math.round((u * (1 + 0.03 * jitter())) * 100) / 100,
      vMs: Math.round((v * (1 + 0.03 * jitter())) * 100) / 100,
    });
  }
  return { elevationM, levels };
}

/** The demo stations: 40 invented sites on a jittered 8 × 5 grid over the region. */
export function demoStations() {
  const random = seededRandom(20270418);
  const jitter = () => random() * 2 - 1;
  return stationNames.map((name, i) => {
    const col = i % 8;
    const row = Math.floor(i / 8);
    const x = (col + 0.5 + 0.35 * jitter()) / 8;
    const y = (row + 0.5 + 0.35 * jitter()) / 5;
    const [longitude, latitude] = demoLonLat(x, y);
    return {
      id: `MV${String(i + 1).padStart(2, '0')}`,
      name,
      x,
      y,
      latitude: Math.round(latitude * 1000) / 1000,
      longitude: Math.round(longitude * 1000) / 1000,
      balloon: i % 4 === 1,
    };
  });
}

/**
 * The demo set: 40 invented stations at three valid times (12 UTC, 18 UTC and 00 UTC next day)
 * of the demo day: 120 soundings. Ten stations are "balloon" sites (observed at 12 and 00 UTC);
 * the rest are model points.
 */
export function generateDemoSoundings(demoDay: Date): DemoSoundingInput[] {
  const random = seededRandom(20270419);
  const jitter = () => random() * 2 - 1;
  const day = Date.UTC(demoDay.getUTCFullYear(), demoDay.getUTCMonth(), demoDay.getUTCDate());
  const times = [12, 18, 24].map((h) => new Date(day + h * 3600_000).toISOString());
  const stations = demoStations();
  const soundings: DemoSoundingInput[] = [];
  times.forEach((validTime, cycle) => {
    for (const station of stations) {
      const { elevationM, levels } = profileAt(station.x, station.y, cycle, jitter);
      const source = station.balloon && cycle !== 1 ? 'observed' : 'model';
      soundings.push({
        metadata: { station: station.id, name: station.name, latitude: station.latitude, longitude: station.longitude, elevationM, validTime, source },
        levels,
      });
    }
  });
  return soundings;
}
