import type { Role } from './domain';

/**
 * Everything a signed-in person may be allowed to do. Routes declare one of these;
 * the server enforces it and the client uses it only to hide what a role cannot do.
 */
export const PERMISSIONS = {
  'user.manage': ['admin'],
  'project.read': ['admin', 'manager', 'designer', 'surveyor', 'field', 'viewer'],
  'project.create': ['admin', 'manager'],
  'project.update': ['admin', 'manager'],
  'project.delete': ['admin'],
  'member.manage': ['admin', 'manager'],
  'bore.write': ['admin', 'designer'],
  'pit.write': ['admin', 'designer'],
  'line.write': ['admin', 'designer'],
  'rule.write': ['admin', 'designer'],
  /** Field crews create holes; designers plan them. */
  'hole.create': ['admin', 'designer', 'field'],
  /** Field crews edit only their own holes, and only until reviewed (checked in the service). */
  'hole.update': ['admin', 'designer', 'field'],
  'hole.delete': ['admin', 'designer', 'field'],
  'hole.survey': ['admin', 'surveyor'],
  'hole.review': ['admin', 'designer'],
  'photo.upload': ['admin', 'designer', 'surveyor', 'field'],
  'conflict.status': ['admin', 'manager', 'designer'],
  'conflict.assign': ['admin', 'manager'],
  'export.read': ['admin', 'manager', 'designer', 'surveyor', 'field', 'viewer'],
  'stakeout.write': ['admin', 'surveyor'],
  'mail.send': ['admin', 'manager'],
  /** Upload or remove a project's base-map tiles (MBTiles). */
  'basemap.upload': ['admin'],
  /** Comments on a conflict's history: everyone who works the job (reviewers read only). */
  'conflict.comment': ['admin', 'manager', 'designer', 'surveyor', 'field'],
  /** The outbox and the development mail catcher (Admin → Mail). */
  'mail.admin': ['admin'],
} as const satisfies Record<string, readonly Role[]>;

export type Permission = keyof typeof PERMISSIONS;

/** True when the role holds the permission. */
export function can(role: Role, permission: Permission): boolean {
  return (PERMISSIONS[permission] as readonly Role[]).includes(role);
}
