import { describe, expect, it } from 'vitest';
import { expandTemplate, latestCycle, privateAddressProblem, pullUrlProblem } from './pull-sources';

describe('expandTemplate', () => {
  it('When the template names the cycle and forecast hour, then each placeholder is filled (UTC, zero-padded)', () => {
    expect(expandTemplate('https://x.test/{yyyy}{mm}{dd}/{hh}/f{fff}-{ff}-{fh}.grib2', new Date('2027-04-08T06:00:00Z'), 9)).toBe('https://x.test/20270408/06/f009-09-9.grib2');
  });
});

describe('latestCycle', () => {
  it('When the delay has passed since the latest cycle hour, then that cycle is due', () => {
    expect(latestCycle(new Date('2027-04-18T14:30:00Z'), [0, 12], 90)?.toISOString()).toBe('2027-04-18T12:00:00.000Z');
  });

  it('When the delay has not passed yet, then the cycle before it is due (across midnight too)', () => {
    expect(latestCycle(new Date('2027-04-18T13:00:00Z'), [0, 12], 90)?.toISOString()).toBe('2027-04-18T00:00:00.000Z');
    expect(latestCycle(new Date('2027-04-18T00:30:00Z'), [0, 12], 60)?.toISOString()).toBe('2027-04-17T12:00:00.000Z');
  });

  it('When no cycle hours are given, then nothing is due', () => {
    expect(latestCycle(new Date('2027-04-18T13:00:00Z'), [], 0)).toBeNull();
  });
});

describe('pullUrlProblem', () => {
  it('When the address is https to a public host, then it is accepted in every environment', () => {
    expect(pullUrlProblem('https://data.example.org/{yyyy}/f{fff}.grib2', 'production')).toBeNull();
  });

  it('When the address is plain http, then only 127.0.0.1 outside production is accepted', () => {
    expect(pullUrlProblem('http://127.0.0.1:8080/{hh}.bufr', 'test')).toBeNull();
    expect(pullUrlProblem('http://127.0.0.1:8080/{hh}.bufr', 'production')).toBe('The address must use https://.');
    expect(pullUrlProblem('http://10.0.0.5/{hh}.bufr', 'development')).toMatch(/only to 127\.0\.0\.1/);
  });

  it('When the address points at a private or local host in production, then it is refused', () => {
    for (const host of ['localhost', '127.0.0.1', '10.1.2.3', '192.168.0.9', '169.254.169.254', '[::1]']) {
      expect(pullUrlProblem(`https://${host}/x.grib2`, 'production'), host).toBe('The address must be a public host, not a local or private network one.');
    }
  });

  it('When the address holds a user name or an unknown placeholder, then it is refused with the reason', () => {
    expect(pullUrlProblem('https://me:pw@data.example.org/x', 'test')).toMatch(/authorization field/);
    expect(pullUrlProblem('https://data.example.org/{run}', 'test')).toMatch(/Unknown placeholder \{run\}/);
    expect(pullUrlProblem('ftp://data.example.org/x', 'test')).toBe('The address must use https://.');
  });
});

describe('privateAddressProblem', () => {
  const resolvesTo = (addresses: string[]) => async () => addresses;

  it('When a public name resolves to a private address in production, then the pull is refused', async () => {
    expect(await privateAddressProblem('https://data.example.org/x', 'production', resolvesTo(['10.0.0.7']))).toBe('the host data.example.org resolves to a local or private network address, which pulls may not reach');
    expect(await privateAddressProblem('https://data.example.org/x', 'production', resolvesTo(['203.0.113.5', '::1']))).toMatch(/resolves to a local or private/);
  });

  it('When every address is public, or outside production, then nothing is refused', async () => {
    expect(await privateAddressProblem('https://data.example.org/x', 'production', resolvesTo(['203.0.113.5']))).toBeNull();
    expect(await privateAddressProblem('http://127.0.0.1:9/x', 'test', resolvesTo(['127.0.0.1']))).toBeNull();
  });

  it('When the name does not resolve, then the pull says so', async () => {
    const fails = async (): Promise<string[]> => {
      throw new Error('ENOTFOUND');
    };
    expect(await privateAddressProblem('https://nowhere.example.org/x', 'production', fails)).toBe('the host nowhere.example.org could not be found');
  });
});
