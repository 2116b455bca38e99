import type { RiskAreaInput } from '../../shared/contracts/outlooks';

const box = (west: number, south: number, east: number, north: number): RiskAreaInput['geometry'] => ({
  type: 'Polygon',
  coordinates: [[[west, south], [east, south], [east, north], [west, north], [west, south]]],
});

/**
 * The invented demo draft: nested areas over the demo region that the demo soundings support
 * to different degrees — the Level 3 core sits where instability and shear overlap, and the
 * north-western Level 2 area is deliberately thin (dry air, little CAPE there).
 */
export const demoOutlookAreas: RiskAreaInput[] = [
  { levelKey: 'thunder', hazards: [], geometry: box(-96.3, 35.7, -87.7, 41.3), label: 'General thunder' },
  { levelKey: 'level1', hazards: [{ hazard: 'wind', significant: false }, { hazard: 'hail', significant: false }], geometry: box(-96.3, 36.0, -88.2, 41.25), label: 'Valley wide' },
  { levelKey: 'level2', hazards: [{ hazard: 'hail', significant: false }, { hazard: 'wind', significant: false }], geometry: box(-95.2, 36.3, -89.0, 39.6), label: 'Warm sector' },
  { levelKey: 'level2', hazards: [{ hazard: 'hail', significant: false }], geometry: box(-96.3, 39.7, -93.6, 41.2), label: 'North-west (thin)' },
  { levelKey: 'level3', hazards: [{ hazard: 'tornado', significant: false }, { hazard: 'hail', significant: true }, { hazard: 'wind', significant: false }], geometry: box(-94.4, 37.0, -91.2, 39.2), label: 'Jet-axis core' },
];

export const demoOutlookHeadline = 'Scattered severe storms this afternoon and evening; a few tornadoes possible near the jet axis';

export const demoOutlookDiscussion = `## Summary
A moist warm sector lies over the southern and eastern valleys, with surface dewpoints near 20 °C. The cap erodes from the west by early afternoon while a strong mid-level jet crosses the middle of the region.

## Hazards
- **Tornado**: low-level shear and helicity are greatest along the jet axis, where the Level 3 area is drawn.
- **Hail**: steep mid-level lapse rates support large hail in the stronger cells.
- **Wind**: damaging gusts are possible as storms grow upscale this evening.

The north-western area is kept at Level 2 for now; moisture there is marginal.`;

export const demoEarlyDiscussion = `## Summary
Morning storms are clearing the northern valleys. A capping inversion holds over the warm sector for now; isolated severe storms are possible where it weakens this afternoon.`;

/** Day 2: storms move into the eastern valleys (invented). */
export const demoDay2Areas: RiskAreaInput[] = [
  { levelKey: 'thunder', hazards: [], geometry: box(-93.5, 35.7, -87.7, 40.5), label: 'General thunder' },
  { levelKey: 'level1', hazards: [{ hazard: 'wind', significant: false }], geometry: box(-92.0, 36.0, -88.0, 39.5), label: 'Eastern valleys' },
];

export const demoDay2Discussion = `## Summary
The cold front reaches the eastern valleys tomorrow afternoon. Damaging gusts are the main hazard in a line of storms along the front.`;
