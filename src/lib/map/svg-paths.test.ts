import { describe, expect, it } from 'vitest';
import { areaPath, fitMercator, linesPath } from './svg-paths';

const bounds = { west: -96, south: 36, east: -88, north: 41 };

describe('fitMercator', () => {
  it('when fitted to a box, puts its west-north corner and east-south corner at the padded edges of the long side', () => {
    const project = fitMercator(bounds, 800, 800, 10);
    const [xWest, yNorth] = project([-96, 41]);
    const [xEast, ySouth] = project([-88, 36]);
    // The box is wider than tall in Mercator here, so the width fills: 10 px to 790 px.
    expect(xWest).toBeCloseTo(10, 6);
    expect(xEast).toBeCloseTo(790, 6);
    expect(yNorth).toBeLessThan(ySouth);
    // Mercator stretches latitude: the northern degree is taller than the southern one.
    expect(project([-92, 41])[1] - project([-92, 40])[1]).toBeLessThan(0);
    expect(Math.abs(project([-92, 41])[1] - project([-92, 40])[1])).toBeGreaterThan(Math.abs(project([-92, 37])[1] - project([-92, 36])[1]));
  });
});

describe('linesPath', () => {
  it('when a line lies far outside the box, leaves it out', () => {
    const project = fitMercator(bounds, 400, 300);
    const d = linesPath({ type: 'MultiLineString', coordinates: [[[-92, 38], [-91, 39]], [[-120, 45], [-119, 46]]] }, project, bounds);
    expect(d.match(/M/g)).toHaveLength(1);
  });
});

describe('areaPath', () => {
  it('when given a polygon with a hole, closes both rings', () => {
    const project = fitMercator(bounds, 400, 300);
    const d = areaPath({ type: 'Polygon', coordinates: [[[-95, 37], [-89, 37], [-89, 40], [-95, 37]], [[-93, 38], [-92, 38], [-92, 39], [-93, 38]]] }, project);
    expect(d.match(/Z/g)).toHaveLength(2);
  });
});
