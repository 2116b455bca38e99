import { capRoutes } from './cap.routes';
import { healthRoutes } from './health.routes';
import { intakeRoutes } from './intake.routes';
import { issuancesRoutes } from './issuances.routes';
import { mailMessagesRoutes } from './mail-messages.routes';
import { meRoutes } from './me.routes';
import { modelRunsRoutes } from './model-runs.routes';
import { modelFieldsRoutes } from './model-fields.routes';
import { officeRoutes } from './office.routes';
import { ogcRoutes } from './ogc.routes';
import { outlooksRoutes } from './outlooks.routes';
import type { RouteDefinition } from './route-definition';
import { soundingsRoutes } from './soundings.routes';
import { subscriptionsRoutes } from './subscriptions.routes';
import { usersRoutes } from './users.routes';
import { verificationRoutes } from './verification.routes';
import { webhooksRoutes } from './webhooks.routes';
import { workflowRoutes } from './workflow.routes';

/** Every API route of the app (better-auth's own routes under /api/auth are separate). */
export const apiRoutes: RouteDefinition[] = [...healthRoutes, ...meRoutes, ...officeRoutes, ...usersRoutes, ...mailMessagesRoutes, ...soundingsRoutes, ...outlooksRoutes, ...workflowRoutes, ...issuancesRoutes, ...subscriptionsRoutes, ...capRoutes, ...ogcRoutes, ...webhooksRoutes, ...verificationRoutes, ...modelRunsRoutes, ...modelFieldsRoutes, ...intakeRoutes];
