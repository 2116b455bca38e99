import { describe, expect, it } from 'vitest';
import { defaultMailFrom, loadConfig } from './config';

describe('loadConfig: base map and mail sender', () => {
  it('when TILE_URL lacks the {z}/{x}/{y} placeholders, start-up refuses and names the variable', () => {
    expect(() => loadConfig({ TILE_URL: 'https://tiles.example.org/map.png' }, [])).toThrow(/TILE_URL/);
  });

  it('when TILE_URL and MAIL_FROM are set, the configuration carries them', () => {
    const config = loadConfig({ TILE_URL: 'https://tiles.example.org/{z}/{x}/{y}.png', MAIL_FROM: 'Office <outlooks@office.example>' }, []);
    expect(config.tileUrl).toBe('https://tiles.example.org/{z}/{x}/{y}.png');
    expect(config.mailFrom).toBe('Office <outlooks@office.example>');
  });

  it('when MAIL_FROM holds no address, start-up refuses and names the variable; unset, the default sender is used', () => {
    expect(() => loadConfig({ MAIL_FROM: 'Outlooks' }, [])).toThrow(/MAIL_FROM/);
    expect(loadConfig({}, []).mailFrom).toBe(defaultMailFrom);
  });
});
