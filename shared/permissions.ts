import type { Role } from './schemas/account';

/**
 * Everything a member may do in a team, as `area:action` strings. The server checks them
 * (server/auth/access.ts decides every request); the client asks the same table only to keep
 * controls off screens where the server would refuse them.
 */
export type Permission =
  | 'team:read'
  | 'team:rename'
  | 'team:delete'
  /** Ask every member to use a second factor, or stop asking. */
  | 'team:require-two-factor'
  | 'team:leave'
  | 'team:export'
  | 'team:import'
  | 'members:list'
  | 'members:invite'
  | 'members:change-role'
  | 'members:remove'
  /** Studies, maps and traces: read them. */
  | 'content:read'
  /** Studies, maps and traces: create, change, share and delete them. */
  | 'content:write'
  /** Keep a share link working after its maker leaves the team. */
  | 'share-links:keep'
  | 'audit:read';

const viewer: Permission[] = ['team:read', 'members:list', 'team:leave', 'content:read'];
const editor: Permission[] = [...viewer, 'content:write'];
const owner: Permission[] = [
  ...editor,
  'team:rename',
  'team:delete',
  'team:require-two-factor',
  'members:invite',
  'members:change-role',
  'members:remove',
  'share-links:keep',
  'audit:read',
  'team:export',
  'team:import',
];

/** What each team role may do. */
const rolePermissions: Record<Role, ReadonlySet<Permission>> = {
  viewer: new Set(viewer),
  editor: new Set(editor),
  owner: new Set(owner),
};

/** What a site admin may do in a team they are not a member of: look, never change. */
const adminPermissions: ReadonlySet<Permission> = new Set(['team:read', 'members:list', 'content:read']);

/** What a member without a second factor may still do in a team that asks for one. */
export const permittedWithoutSecondFactor: ReadonlySet<Permission> = new Set(['team:leave']);

/** Whether someone with `role` in a team (null: not a member) may do `permission` there. */
export function can(role: Role | null, permission: Permission, isAdmin = false): boolean {
  if (role && rolePermissions[role].has(permission)) return true;
  return isAdmin && adminPermissions.has(permission);
}
