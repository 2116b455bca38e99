import { officeSettingsInputSchema } from '../../shared/contracts/office';
import { access } from '../auth/require-role';
import { parseInput, sendResult } from '../middleware/error-handler';
import { getOfficeSettings, updateOfficeSettings } from '../services/office.service';
import { adminRoles } from '../../shared/workflow/roles';
import { route } from './route-definition';
import { baseMapOf } from '../config';

export const officeRoutes = [
  route({
    method: 'get',
    path: '/api/office',
    // Public: the bulletin needs the office name, time zone and risk ladder.
    access: access.public,
    handler: async (ctx, _req, res) => sendResult(res, await getOfficeSettings(ctx.db, baseMapOf(ctx.config))),
  }),
  route({
    method: 'put',
    path: '/api/office',
    access: access.roles(...adminRoles),
    handler: async (ctx, req, res) => {
      const input = parseInput(officeSettingsInputSchema, req.body);
      if (!input.ok) return sendResult(res, input);
      sendResult(res, await updateOfficeSettings(ctx.db, input.value, baseMapOf(ctx.config)));
    },
  }),
];
