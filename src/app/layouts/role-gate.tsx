import { ShieldAlert } from 'lucide-react';
import { Outlet } from 'react-router';
import { ButtonLink } from '../../components/ui/button';
import { useMe } from '../../hooks/use-me';
import type { Role } from '../../../shared/contracts/common';
import { hasRole } from '../../../shared/workflow/roles';
import { homePathFor } from '../../utils/roles';

/** Shown instead of a page the signed-in role may not open. The server refuses it too. */
export function AccessDenied({ role }: { role: Role }) {
  return (
    <section aria-labelledby="access-denied-title" className="max-w-lg rounded-lg border border-line bg-panel p-6">
      <div className="flex items-start gap-3">
        <ShieldAlert aria-hidden className="mt-0.5 size-5 shrink-0 text-warning" />
        <div>
          <h1 id="access-denied-title" className="text-base font-semibold">
            Your role ({role}) cannot open this page
          </h1>
          <p className="mt-1 text-sm text-ink-muted">
            This page belongs to another role. If you need it for your work, ask your office administrator to change your
            role.
          </p>
          <ButtonLink to={homePathFor(role)} variant="secondary" size="sm" className="mt-4">
            Go to your home page
          </ButtonLink>
        </div>
      </div>
    </section>
  );
}

/** Renders its child routes only for the listed roles. Used inside the signed-in layout. */
export function RoleGate({ roles }: { roles: readonly Role[] }) {
  const me = useMe();
  const role = me.data?.user.role;
  if (role === undefined) return null;
  return hasRole(role, roles) ? <Outlet /> : <AccessDenied role={role} />;
}
