import { describe, expect, it } from 'vitest';
import { boundedAreaGeometrySchema } from '../contracts/outlooks';
import { countVertices, MAX_VERTICES_PER_AREA } from './limits';

const ringOf = (n: number): [number, number][] => {
  const ring = Array.from({ length: n - 1 }, (_, i): [number, number] => [Math.cos((2 * Math.PI * i) / (n - 1)), Math.sin((2 * Math.PI * i) / (n - 1))]);
  return [...ring, ring[0] ?? [1, 0]];
};

describe('countVertices', () => {
  it('When a multipolygon has a hole, then every ring of every polygon counts, closing positions included', () => {
    expect(countVertices({ type: 'MultiPolygon', coordinates: [[ringOf(5), ringOf(4)], [ringOf(6)]] })).toBe(15);
  });
});

describe('boundedAreaGeometrySchema', () => {
  const schema = boundedAreaGeometrySchema(MAX_VERTICES_PER_AREA, 'This area');
  it('When an area has exactly the limit, then it passes; one more, then the issue names the points and the limit', () => {
    expect(schema.safeParse({ type: 'Polygon', coordinates: [ringOf(MAX_VERTICES_PER_AREA)] }).success).toBe(true);
    const over = schema.safeParse({ type: 'Polygon', coordinates: [ringOf(MAX_VERTICES_PER_AREA + 1)] });
    expect(over.success).toBe(false);
    expect(over.error?.issues[0]?.message).toBe('This area has 10,001 points; the limit is 10,000. Simplify the outline and try again.');
    expect(over.error?.issues[0]?.path).toEqual(['coordinates']);
  });
});
