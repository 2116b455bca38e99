import type { RiskAreaInput } from '../../shared/contracts/outlooks';

/** A closed polygon from hand-drawn [longitude, latitude] vertices (the first is repeated last). */
const outline = (...vertices: [number, number][]): RiskAreaInput['geometry'] => {
  const first = vertices[0];
  if (!first) throw new Error('an outline needs vertices');
  return { type: 'Polygon', coordinates: [[...vertices, first]] };
};

/**
 * The invented demo draft, drawn as a forecaster would over the invented demo fields of
 * server/seed/demo-soundings.ts (nothing here is an observed or issued outlook). Each higher
 * level lies inside the one below. What each area is meant to show in the support check, over
 * the draft's period (the 18 and 00 UTC soundings; figures are rough medians):
 *
 * - General thunder: everywhere with some instability, elevated north of the warm front too
 *   (MUCAPE near 1,000 J/kg); leaves out the dry south-western corner behind the dryline:
 *   *supported*.
 * - Valley wide (Level 1): the warm sector, the dryline, and the band of elevated instability
 *   north of the front, where a cool surface layer leaves little MLCAPE and the cap holds
 *   longest in the east: *supported* at Level 1, about 40 % of its soundings back Level 2.
 *   Hail (elevated MUCAPE, 700–500 hPa lapse rates near 7.3 °C/km) fits better than wind.
 * - Warm sector (Level 2): the moist tongue between the dryline and the front; MLCAPE
 *   1,500–3,000 J/kg, 0–6 km shear 16–18 m/s in the south and more near the front: *supported*
 *   (only the soundings near the front back Level 3). Hail: MUCAPE near 3,000 J/kg, CAPE
 *   near 1,000 J/kg between −10 and −30 °C, lapse rates near 7.5 °C/km; wind: downdraft
 *   CAPE near 1,000 J/kg.
 * - Southern lowlands (Level 1; flooding, wind): deep moisture (precipitable water near 37 mm,
 *   warm-cloud depth near 3 km), a low-level jet nearly parallel to the cloud-layer wind (upwind
 *   Corfidi vector near 6 m/s: slow, backbuilding storms), MLCAPE mostly above 1,000 J/kg with
 *   16–18 m/s of shear: most soundings back Level 2, so the *environment exceeds the level*.
 *   Flooding is well backed; wind less so (downdraft CAPE near 850 J/kg, weak mean wind).
 * - Dryline and low (Level 2; wind, hail): six soundings, two of which back Level 2; the rest
 *   lie west of the dryline (cloud base 2–3 km, little CAPE) or under the cap near the low:
 *   *thin support*. Wind is backed better (downdraft CAPE above 1,100 J/kg, 0–3 km lapse rates
 *   near 8.7 °C/km) than hail (MUCAPE near 1,300 J/kg, under half the warm sector's).
 * - Warm-front corridor (Level 3; tornado, significant hail, wind): backed surface winds under
 *   the low-level jet along the warm side of the front: 0–500 m SRH near 150 m²/s², 0–1 km SRH
 *   130–250 m²/s², cloud base near 750 m, effective shear near 26 m/s, MLCAPE 1,500–3,000 J/kg:
 *   *supported*, tornado included. It falls short of Level 4: most of its soundings have 0–1 km
 *   SRH under 200 m²/s².
 */
export const demoOutlookAreas: RiskAreaInput[] = [
  {
    levelKey: 'thunder',
    hazards: [],
    label: 'General thunder',
    geometry: outline(
      [-94.9, 35.58], [-92.6, 35.56], [-90.2, 35.55], [-87.62, 35.58], [-87.58, 37.1], [-87.6, 39.2], [-87.56, 40.6], [-87.62, 41.42], [-88.7, 41.45],
      [-90.1, 41.38], [-92.5, 41.42], [-94.35, 41.35], [-95.65, 40.9], [-96.45, 40.15], [-96.46, 38.9], [-96.4, 37.95], [-95.75, 37.15], [-95.2, 36.3],
    ),
  },
  {
    levelKey: 'level1',
    hazards: [{ hazard: 'hail', significant: false }, { hazard: 'wind', significant: false }],
    label: 'Valley wide',
    geometry: outline(
      [-96.4, 38.25], [-96.35, 39.1], [-96.3, 39.9], [-95.6, 40.55], [-94.5, 40.95], [-93.2, 41.1], [-91.9, 41.0], [-90.6, 40.6], [-89.3, 40.1],
      [-88.4, 39.45], [-88.3, 38.8], [-88.9, 38.2], [-89.9, 37.95], [-90.5, 37.2], [-90.7, 36.4], [-91.0, 35.8], [-91.7, 35.6], [-92.9, 35.62],
      [-93.75, 35.85], [-94.15, 36.5], [-94.5, 37.3], [-95.3, 37.8], [-95.95, 37.95],
    ),
  },
  {
    levelKey: 'level2',
    hazards: [{ hazard: 'hail', significant: false }, { hazard: 'wind', significant: false }],
    label: 'Warm sector',
    geometry: outline(
      [-94.02, 39.05], [-93.85, 39.6], [-93.3, 39.85], [-92.3, 39.7], [-91.3, 39.45], [-90.6, 39.25], [-90.4, 38.7], [-90.75, 38.0], [-90.85, 37.3],
      [-91.0, 36.6], [-91.3, 36.0], [-91.9, 35.7], [-92.8, 35.75], [-93.5, 36.1], [-93.75, 36.7], [-94.2, 37.3], [-94.1, 37.9], [-93.95, 38.5],
    ),
  },
  {
    levelKey: 'level1',
    hazards: [{ hazard: 'flood', significant: false }, { hazard: 'wind', significant: false }],
    label: 'Southern lowlands',
    geometry: outline(
      [-90.7, 35.85], [-90.45, 35.62], [-89.2, 35.58], [-87.7, 35.65], [-87.62, 36.4], [-87.75, 37.2], [-88.1, 37.85], [-89.0, 37.85], [-89.8, 37.7],
      [-90.3, 37.1], [-90.5, 36.35],
    ),
  },
  {
    levelKey: 'level2',
    hazards: [{ hazard: 'wind', significant: false }, { hazard: 'hail', significant: false }],
    label: 'Dryline and low',
    geometry: outline(
      [-95.7, 38.35], [-95.2, 38.05], [-94.3, 37.95], [-94.15, 38.25], [-94.0, 38.55], [-94.07, 39.1], [-93.92, 39.65], [-94.3, 40.25], [-94.9, 40.35],
      [-95.6, 40.05], [-96.1, 39.5], [-96.05, 38.85],
    ),
  },
  {
    levelKey: 'level3',
    hazards: [{ hazard: 'tornado', significant: false }, { hazard: 'hail', significant: true }, { hazard: 'wind', significant: false }],
    label: 'Warm-front corridor',
    geometry: outline(
      [-93.8, 39.15], [-93.55, 39.55], [-93.1, 39.6], [-92.4, 39.45], [-91.6, 39.25], [-90.95, 39.05], [-90.85, 38.75], [-91.3, 38.3], [-91.9, 38.2],
      [-92.6, 38.35], [-93.3, 38.55], [-93.75, 38.8],
    ),
  },
];

export const demoOutlookHeadline = 'Scattered severe storms this afternoon and evening; a few tornadoes possible along the warm front';

export const demoOutlookDiscussion = `## Summary
A surface low over the western valleys drifts north-east today. Its warm front runs east-south-east across the middle of the region; a dryline trails south from the low. South of the front a moist tongue (surface dewpoints near 20 °C) reaches north-west toward the low under steep mid-level lapse rates. The cap erodes from the west this afternoon but holds longest in the east.

## Hazards
- **Tornado**: surface winds back along the warm front under a strengthening low-level jet, and cloud bases are low there: the Level 3 corridor.
- **Hail**: steep mid-level lapse rates and strong shear support large hail in the warm sector, and in elevated storms north of the front.
- **Wind**: high-based storms near the dryline and the low can bring damaging gusts.
- **Flash flooding**: deep moisture over the southern lowlands and storms that keep forming upwind.

The dryline area is kept at Level 2 for now; moisture there is marginal and cloud bases are high.`;

export const demoEarlyDiscussion = `## Summary
Morning storms are clearing the northern valleys behind the warm front. A capping inversion holds over the warm sector for now; isolated severe storms are possible where it weakens this afternoon.`;

/** Day 2: the front and the storms move into the eastern valleys (invented). */
export const demoDay2Areas: RiskAreaInput[] = [
  {
    levelKey: 'thunder',
    hazards: [],
    label: 'General thunder',
    geometry: outline([-93.4, 35.8], [-91.0, 35.62], [-88.2, 35.7], [-87.7, 36.6], [-87.75, 38.3], [-88.3, 39.9], [-89.6, 40.45], [-91.3, 40.2], [-92.6, 39.3], [-93.2, 37.9]),
  },
  {
    levelKey: 'level1',
    hazards: [{ hazard: 'wind', significant: false }],
    label: 'Eastern valleys',
    geometry: outline([-91.7, 36.2], [-90.1, 35.9], [-88.5, 36.1], [-88.05, 37.0], [-88.2, 38.4], [-88.9, 39.4], [-90.0, 39.35], [-90.9, 38.6], [-91.55, 37.4]),
  },
];

export const demoDay2Discussion = `## Summary
The cold front reaches the eastern valleys tomorrow afternoon. Damaging gusts are the main hazard in a line of storms along the front.`;
