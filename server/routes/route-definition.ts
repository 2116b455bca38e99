import type { Request, RequestHandler, Response } from 'express';
import type { Access } from '../auth/require-role';
import type { AppContext } from '../context';

export type HttpMethod = 'get' | 'post' | 'put' | 'patch' | 'delete';

/**
 * One API route: its method, path, who may call it, and a thin handler. Every route of the app
 * is declared this way so that roles are enforced by one middleware and the role-matrix test can
 * list them all.
 */
export interface RouteDefinition {
  method: HttpMethod;
  path: string;
  access: Access;
  /** Extra middleware after the access check (e.g. multer for uploads). */
  before?: RequestHandler[];
  handler: (ctx: AppContext, req: Request, res: Response) => Promise<void> | void;
}

export const route = (definition: RouteDefinition): RouteDefinition => definition;
