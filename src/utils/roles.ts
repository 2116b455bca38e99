import type { Role } from '../../shared/contracts/common';
import { roleLabels } from '../../shared/workflow/roles';

/** Where each role lands after signing in, and where `/` sends them. */
export function homePathFor(role: Role): string {
  switch (role) {
    case 'forecaster':
      return '/desk';
    case 'lead':
      return '/review';
    case 'subscriber':
      return '/alerts';
    case 'admin':
      return '/admin/users';
  }
}

export function roleName(role: Role): string {
  return roleLabels[role];
}

/**
 * Where to go after signing in: the page the person was sent away from, when it is a path inside
 * this app, otherwise their role's home. Rejects `//host` and absolute URLs (open redirect).
 */
export function pathAfterSignIn(role: Role, next: string | null): string {
  if (next !== null && next.startsWith('/') && !next.startsWith('//') && !next.startsWith('/sign-in')) return next;
  return homePathFor(role);
}
