import { createAuthClient } from 'better-auth/react';
import { adminClient } from 'better-auth/client/plugins';

/**
 * better-auth's browser client. The server mounts better-auth at `/api/auth` on the same origin.
 * The role and preferences shown in the app come from `GET /api/me`, not from this client.
 */
export const authClient = createAuthClient({
  baseURL: typeof window === 'undefined' ? 'http://localhost' : window.location.origin,
  basePath: '/api/auth',
  plugins: [adminClient()],
});
