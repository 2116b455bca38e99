import { isIP } from 'node:net';

/** Addresses an endpoint may not point at in production: loopback, private, link-local, unspecified. */
function isInternalAddress(host: string): boolean {
  const bare = host.replace(/^\[|\]$/g, '').toLowerCase();
  if (bare === 'localhost' || bare.endsWith('.localhost')) return true;
  const version = isIP(bare);
  if (version === 4) {
    const [a = 0, b = 0] = bare.split('.').map(Number);
    return a === 0 || a === 10 || a === 127 || (a === 169 && b === 254) || (a === 172 && b >= 16 && b <= 31) || (a === 192 && b === 168) || (a === 100 && b >= 64 && b <= 127);
  }
  if (version === 6) return bare === '::' || bare === '::1' || bare.startsWith('fc') || bare.startsWith('fd') || bare.startsWith('fe80') || bare.startsWith('::ffff:');
  return false;
}

/**
 * Which endpoint addresses are accepted: https:// anywhere public; plain http:// only to
 * 127.0.0.1 and only outside production (tests and local receivers). No user name or password
 * in the address (it would be stored and shown). Returns a message for the person, or null.
 */
export function webhookUrlProblem(value: string, env: 'development' | 'production' | 'test'): string | null {
  let url: URL;
  try {
    url = new URL(value);
  } catch {
    return 'Enter a full address, e.g. https://alerts.example.org/stormdraft.';
  }
  if (url.username || url.password) return 'Leave the user name and password out of the address; the signature authenticates each delivery.';
  if (url.protocol === 'http:') {
    if (env !== 'production' && url.hostname === '127.0.0.1') return null;
    return env === 'production' ? 'The endpoint must use https://.' : 'The endpoint must use https:// (plain http:// is allowed only to 127.0.0.1 outside production).';
  }
  if (url.protocol !== 'https:') return 'The endpoint must use https://.';
  if (env === 'production' && isInternalAddress(url.hostname)) return 'The endpoint must be a public address, not a local or private network one.';
  return null;
}
