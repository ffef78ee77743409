import { z } from 'zod';
import { roleSchema, type Role } from './roles';

/** Who may use a route: anyone, any signed-in member, or the listed roles. */
export const accessSchema = z.union([z.literal('public'), z.literal('member'), z.array(roleSchema)]);
export type Access = z.infer<typeof accessSchema>;

export const permissionRowSchema = z.object({
  action: z.string(),
  label: z.string(),
  roles: z.array(roleSchema),
});
export type PermissionRow = z.infer<typeof permissionRowSchema>;

/** GET /api/permissions: each action with the roles allowed it. */
export const permissionTableSchema = z.object({ actions: z.array(permissionRowSchema) });
export type PermissionTable = z.infer<typeof permissionTableSchema>;

export function rolesOf(access: Access, all: readonly Role[]): Role[] {
  return access === 'public' || access === 'member' ? [...all] : access;
}
