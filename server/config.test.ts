import { describe, expect, it } from 'vitest';
import { loadConfig, parseTrustProxy } from './config';

const productionEnv = { NODE_ENV: 'production', BETTER_AUTH_SECRET: 'a-production-secret-that-is-long-enough-0123' };

describe('loadConfig', () => {
  it('When production has no SMTP_URL, then start-up is refused with a message naming SMTP_URL (issue 11 item 12)', () => {
    expect(() => loadConfig(productionEnv, [])).toThrow(/SMTP_URL is not set/);
  });

  it('When production has an SMTP_URL, then the configuration loads', () => {
    expect(loadConfig({ ...productionEnv, SMTP_URL: 'smtp://relay.example.org:587' }, []).smtpUrl).toBe('smtp://relay.example.org:587');
  });

  it('When TRUST_PROXY is not set, then no proxy is trusted (X-Forwarded-For is ignored)', () => {
    expect(loadConfig({ NODE_ENV: 'test' }, []).trustProxy).toBe(false);
  });

  it('When TRUST_PROXY is "true", then start-up is refused', () => {
    expect(() => loadConfig({ NODE_ENV: 'test', TRUST_PROXY: 'true' }, [])).toThrow(/TRUST_PROXY/);
  });
});

describe('parseTrustProxy', () => {
  it('When proxies are listed, then addresses, CIDR ranges and names are kept', () => {
    expect(parseTrustProxy('loopback, 10.0.0.0/8, 192.168.1.5, fd00::/8')).toEqual(['loopback', '10.0.0.0/8', '192.168.1.5', 'fd00::/8']);
  });

  it('When a hop count is given, then it is a number', () => {
    expect(parseTrustProxy('1')).toBe(1);
  });

  it.each(['everyone', '10.0.0.0/99', '300.1.1.1'])('When TRUST_PROXY is "%s", then it is an error', (value) => {
    expect(parseTrustProxy(value)).toMatchObject({ error: expect.stringContaining(value.split('/')[0] ?? value) });
  });
});
