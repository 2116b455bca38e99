import { describe, expect, it } from 'vitest';
import { markdownExcerpt } from './markdown-excerpt';

describe('markdownExcerpt', () => {
  it('when the discussion starts with a heading, the excerpt is the first paragraph, without marks', () => {
    expect(markdownExcerpt('## Synopsis\n\nA **moist** warm sector with `MLCAPE` near [2000 J/kg](https://example.org).\n\nSecond paragraph.')).toBe('A moist warm sector with MLCAPE near 2000 J/kg.');
  });

  it('when words contain hyphens, underscores or stars inside them, they are kept (a regex stripping marks lost them)', () => {
    expect(markdownExcerpt('Low-level shear of 0–1 km near snake_case_station and 5*3 cells.')).toBe('Low-level shear of 0–1 km near snake_case_station and 5*3 cells.');
  });

  it('when the first paragraph is long, it is cut at a word with an ellipsis and stays within the limit', () => {
    const excerpt = markdownExcerpt(`${'storms '.repeat(100)}end`, 50);
    expect(excerpt.length).toBeLessThanOrEqual(50);
    expect(excerpt.endsWith('storms…')).toBe(true);
  });

  it('when there is no paragraph, the excerpt is empty', () => {
    expect(markdownExcerpt('# Only a heading\n\n- a list item')).toBe('');
  });
});
