import { createAccessControl } from 'better-auth/plugins/access';
import { adminAc, defaultStatements } from 'better-auth/plugins/admin/access';

/**
 * Our four roles for better-auth's admin plugin. Only `admin` may use the plugin's own user
 * management endpoints; what each role may do in the product is enforced by our route table
 * (server/routes) and services.
 */
export const authAccessControl = createAccessControl(defaultStatements);

export const authRoles = {
  admin: authAccessControl.newRole(adminAc.statements),
  lead: authAccessControl.newRole({}),
  forecaster: authAccessControl.newRole({}),
  subscriber: authAccessControl.newRole({}),
};
