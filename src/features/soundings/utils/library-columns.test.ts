import { describe, expect, it } from 'vitest';
import { parseLibraryColumns, toggleLibraryColumn } from './library-columns';

describe('library extra columns', () => {
  it('when storage holds known and unknown keys, keeps the known ones in the chooser order', () => {
    expect(parseLibraryColumns(JSON.stringify(['warmCloudDepthM', 'nonsense', 'srh0to500m', 3]))).toEqual(['srh0to500m', 'warmCloudDepthM']);
  });

  it('when storage holds nothing or something that is not a list, no extra columns', () => {
    expect(parseLibraryColumns(null)).toEqual([]);
    expect(parseLibraryColumns('{not json')).toEqual([]);
    expect(parseLibraryColumns('{"a":1}')).toEqual([]);
  });

  it('when a column is turned on and off, the list follows in the chooser order', () => {
    const on = toggleLibraryColumn(toggleLibraryColumn([], 'corfidiUpwindMs', true), 'srh0to500m', true);
    expect(on).toEqual(['srh0to500m', 'corfidiUpwindMs']);
    expect(toggleLibraryColumn(on, 'srh0to500m', false)).toEqual(['corfidiUpwindMs']);
  });
});
