import type { NextFunction, Request, Response } from 'express';
import { fromNodeHeaders } from 'better-auth/node';
import { roleSchema, type Role } from '../../shared/contracts/common';
import { appError } from '../../shared/errors';
import type { AppContext } from '../context';
import { sendError } from '../middleware/error-handler';

/** Who may call a route: anyone, any signed-in user, or the listed roles. */
export type Access = { kind: 'public' } | { kind: 'signed-in' } | { kind: 'roles'; roles: readonly Role[] };

export const access = {
  public: { kind: 'public' } as Access,
  signedIn: { kind: 'signed-in' } as Access,
  roles: (...roles: Role[]): Access => ({ kind: 'roles', roles }),
};

/** The signed-in person making a request, as services see them. */
export interface Actor {
  userId: string;
  name: string;
  email: string;
  role: Role;
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace -- Express types res.locals in this global namespace; merging into it is the typed way.
  namespace Express {
    interface Locals {
      /** Set by requireAccess: the signed-in actor, or null on a public route. */
      actor?: Actor | null;
    }
  }
}

/** Reads the better-auth session for a request; null when there is none (or the user is disabled). */
export async function readActor(ctx: AppContext, req: Request): Promise<Actor | null> {
  const session = await ctx.auth.api.getSession({ headers: fromNodeHeaders(req.headers) });
  if (!session || session.user.banned) return null;
  const role = roleSchema.safeParse(session.user.role);
  if (!role.success) return null;
  return { userId: session.user.id, name: session.user.name, email: session.user.email, role: role.data };
}

/**
 * The one middleware that enforces roles on every API route: 401 without a session,
 * 403 when the role is not allowed. The actor is left in `res.locals.actor`.
 */
export function requireAccess(ctx: AppContext, rule: Access) {
  return async (req: Request, res: Response, next: NextFunction) => {
    if (rule.kind === 'public') {
      res.locals.actor = null;
      return next();
    }
    const actor = await readActor(ctx, req);
    if (!actor) return sendError(res, appError('UNAUTHENTICATED'));
    if (rule.kind === 'roles' && !rule.roles.includes(actor.role)) {
      return sendError(res, appError('FORBIDDEN', `Your role (${actor.role}) does not allow this action.`));
    }
    res.locals.actor = actor;
    next();
  };
}

/** The actor left by requireAccess on a route that is not public. */
export function actorOf(res: Response): Actor {
  const actor = res.locals.actor;
  if (!actor) throw new Error('actorOf() used on a route without a signed-in requirement');
  return actor;
}
