import { describe, expect, it } from 'vitest';
import { toSoundingInput } from './to-sounding-input';

describe('toSoundingInput', () => {
  it('When a level is given in BUFR units, then it comes out in hPa, °C and wind components', () => {
    const input = toSoundingInput({
      station: '72901',
      latitude: 38.4,
      longitude: -91.3,
      elevationM: 183,
      launchTime: '2027-04-18T11:02:00.000Z',
      levelsWithoutTemperature: 0,
      // 273.15 K is 0 °C by the definition of the Celsius scale; a 270° wind of 10 m/s blows toward the east (common practice).
      levels: [{ pressurePa: 85000, geopotentialHeightM: 1500, temperatureK: 273.15, dewpointK: 263.15, windDirectionDeg: 270, windSpeedMs: 10 }],
    });
    expect(input.metadata).toEqual({ station: '72901', name: '', latitude: 38.4, longitude: -91.3, elevationM: 183, validTime: '2027-04-18T11:02:00.000Z', source: 'observed' });
    expect(input.levels).toEqual([{ pressureHpa: 850, heightM: 1500, temperatureC: 0, dewpointC: -10, uMs: 10, vMs: 0 }]);
  });

  it('When wind or dewpoint is missing, then the level keeps its temperature and leaves them empty', () => {
    const input = toSoundingInput({ station: '', latitude: null, longitude: null, elevationM: null, launchTime: null, levelsWithoutTemperature: 0, levels: [{ pressurePa: 50000, geopotentialHeightM: null, temperatureK: 253.15, dewpointK: null, windDirectionDeg: 200, windSpeedMs: null }] });
    expect(input.levels).toEqual([{ pressureHpa: 500, heightM: null, temperatureC: -20, dewpointC: null, uMs: null, vMs: null }]);
  });
});
