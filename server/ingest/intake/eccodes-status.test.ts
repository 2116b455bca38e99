import { afterEach, describe, expect, it } from 'vitest';
import { eccodesStatus } from './eccodes-status';

const savedPath = process.env.PATH;
afterEach(() => {
  process.env.PATH = savedPath;
});

describe('eccodesStatus', () => {
  it('When codes_info is on the PATH, then ecCodes is available with its version', async () => {
    const status = await eccodesStatus(1_000_000);
    expect(status.available).toBe(true);
    expect(status.version).toMatch(/^\d+\.\d+\.\d+$/);
  });

  it('When ecCodes is not installed, then it is reported missing (and nothing throws)', async () => {
    process.env.PATH = '/nonexistent-folder';
    // A time far past the cached answer, so the check runs again.
    expect(await eccodesStatus(10_000_000)).toEqual({ available: false, version: null });
  });
});
