import { describe, expect, it } from 'vitest';
import { sanitizeUrl } from './request-logger';

describe('sanitizeUrl', () => {
  it('When a reset link is logged, then its token path segment is replaced', () => {
    expect(sanitizeUrl('/api/auth/reset-password/AbC123xyz?callbackURL=%2Freset-password')).toBe('/api/auth/reset-password/[redacted]?callbackURL=%2Freset-password');
  });

  it('When a token is in the query, then only its value is replaced', () => {
    expect(sanitizeUrl('/api/unsubscribe?token=abc.def&format=html')).toBe('/api/unsubscribe?token=[redacted]&format=html');
    expect(sanitizeUrl('/api/auth/verify-email?token=eyJhbGc&callbackURL=%2Falerts')).toBe('/api/auth/verify-email?token=[redacted]&callbackURL=%2Falerts');
  });

  it('When a callback URL carries a token of its own, then that is replaced too', () => {
    expect(sanitizeUrl('/api/x?callbackURL=%2Fdone%3Ftoken%3Dsecret123')).not.toContain('secret123');
  });

  it('When the URL has no secrets, then it is unchanged', () => {
    expect(sanitizeUrl('/api/public/issuances?q=hail&page=2')).toBe('/api/public/issuances?q=hail&page=2');
  });
});
