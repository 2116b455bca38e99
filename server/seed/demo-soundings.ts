/**
 * Invented demo soundings for the Meridian Valley demo office: a spring day with a moist warm
 * sector in the south-east, a capping inversion that weakens westward through the day and a
 * strong mid-level jet across the middle of the region. Smooth analytic fields plus a small,
 * seeded perturbation; nothing here is observed data. Heights are left out on purpose: the
 * engine fills them with the hypsometric equation.
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
  'Orchard Hill', 'Thistle Bank', 'Verden', 'Millrace', 'Yarrow', 'Northcote',
];

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

const region = { west: -96.5, south: 35.5, east: -87.5, north: 41.5 };

function smoothstep(x: number): number {
  const t = Math.min(1, Math.max(0, x));
  return t * t * (3 - 2 * t);
}

/**
 * One profile at a place and hour. x: 0 west … 1 east; y: 0 south … 1 north; hour of the
 * day's cycle 0 (12 UTC), 1 (18 UTC), 2 (00 UTC next day).
 */
function profileAt(x: number, y: number, cycle: number, jitter: () => number): { elevationM: number; levels: DemoSoundingInput['levels'] } {
  const elevationM = Math.round(420 - 300 * x + 60 * Math.sin(6 * y) + 20 * jitter());
  const surfacePressure = Math.round((1013.25 * Math.exp(-elevationM / 8400) - 2 * y) * 10) / 10;
  const heating = [0, 6, 4][cycle] ?? 0;
  const warmSector = smoothstep((0.85 - y) * 2.2 + (x - 0.15) * 0.8); // moist south-east
  const surfaceT = 20 + 6 * (1 - y) + heating + 1.5 * jitter();
  const surfaceTd = 8 + 12 * warmSector + 1 * jitter() - (cycle === 1 ? 1 : 0);
  // The cap: strong in the east early, weakening westward and with heating.
  const capStrength = Math.max(0, 4.5 * x + 1.5 - 2.2 * cycle + 0.5 * jitter());
  const capBase = surfacePressure - 120;
  const jetAxis = 0.5 + 0.1 * cycle; // drifts north through the day
  const jet = 28 * Math.exp(-(((y - jetAxis) / 0.28) ** 2)) + 12; // m/s at 500 hPa

  const levels: DemoSoundingInput['levels'] = [];
  let temperature = surfaceT;
  let previousPressure = surfacePressure;
  const mixingRatioSurface = (() => {
    const e = 6.112 * Math.exp((17.67 * surfaceTd) / (surfaceTd + 243.5));
    return (0.622 * e) / (surfacePressure - e);
  })();
  for (let p = surfacePressure; p >= 100; p -= p > 700 ? 10 : 15) {
    const pressure = Math.round(p * 10) / 10;
    if (pressure !== surfacePressure) {
      // Dry-adiabatic mixed layer below the cap, the inversion, then a steep mid-level lapse rate.
      const dz = 29.3 * (temperature + 273.15) * Math.log(previousPressure / pressure);
      if (pressure > capBase) temperature -= (9.3 * dz) / 1000;
      else if (pressure > capBase - 25) temperature += (capStrength * (previousPressure - pressure)) / 25;
      else if (pressure > 250) temperature -= ((7.4 + 0.6 * x) * dz) / 1000;
      else temperature -= dz / 1000;
      if (pressure <= 200) temperature = Math.max(temperature, -58);
    }
    previousPressure = pressure;
    let dewpoint: number;
    if (pressure > capBase) {
      const e = (mixingRatioSurface * pressure) / (0.622 + mixingRatioSurface);
      const ln = Math.log(e / 6.112);
      dewpoint = (243.5 * ln) / (17.67 - ln);
    } else {
      const depression = 12 + 14 * (1 - warmSector) + 6 * Math.sin(pressure / 60) + (pressure < 300 ? 10 : 0);
      dewpoint = temperature - Math.max(3, depression);
    }
    dewpoint = Math.min(dewpoint, temperature);
    const heightFraction = Math.max(0, Math.log(surfacePressure / pressure) / Math.log(surfacePressure / 100));
    // Winds veer from south-south-east at the ground to west-south-west aloft, with a low-level
    // jet near the jet axis and the strongest winds near 300 hPa.
    const directionDeg = 150 + 105 * Math.min(1, Math.sqrt(heightFraction * 3));
    const lowLevelJet = 14 * Math.exp(-(((y - jetAxis) / 0.3) ** 2)) * Math.exp(-(((surfacePressure - 130 - pressure) / 60) ** 2));
    const speed = (6 + lowLevelJet + 0.9 * jet * Math.min(1, heightFraction * 2.2) + 14 * Math.exp(-(((pressure - 300) / 120) ** 2))) * (0.95 + 0.1 * jitter());
    const radians = (directionDeg * Math.PI) / 180;
    levels.push({
      pressureHpa: pressure,
      temperatureC: Math.round(temperature * 10) / 10,
      dewpointC: Math.round(dewpoint * 10) / 10,
      uMs: Math.round(-speed * Math.sin(radians) * 100) / 100,
      vMs: Math.round(-speed * Math.cos(radians) * 100) / 100,
    });
  }
  return { elevationM, levels };
}

/**
 * The demo set: 30 invented stations on a jittered grid over the region, at three valid times
 * (12 UTC, 18 UTC and 00 UTC next day) of the demo day: 90 soundings. Eight stations are
 * "balloon" sites (observed at 12 and 00 UTC); the rest are model points.
 */
export function generateDemoSoundings(demoDay: Date): DemoSoundingInput[] {
  const random = seededRandom(20270418);
  const jitter = () => random() * 2 - 1;
  const day = Date.UTC(demoDay.getUTCFullYear(), demoDay.getUTCMonth(), demoDay.getUTCDate());
  const times = [12, 18, 24].map((h) => new Date(day + h * 3600_000).toISOString());
  const stations = stationNames.map((name, i) => {
    const col = i % 6;
    const row = Math.floor(i / 6);
    const x = (col + 0.5 + 0.35 * jitter()) / 6;
    const y = (row + 0.5 + 0.35 * jitter()) / 5;
    return {
      id: `MV${String(i + 1).padStart(2, '0')}`,
      name,
      x,
      y,
      latitude: Math.round((region.south + y * (region.north - region.south)) * 1000) / 1000,
      longitude: Math.round((region.west + x * (region.east - region.west)) * 1000) / 1000,
      balloon: i % 4 === 1,
    };
  });
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

