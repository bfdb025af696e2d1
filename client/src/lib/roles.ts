import { EDITING_ROLES, type Role } from '@shared/api';

/** How roles read in the interface. */
export const ROLE_LABELS: Record<Role, string> = {
  admin: 'Admin',
  engineer: 'Engineer',
  viewer: 'Viewer',
};

export const ROLE_DESCRIPTIONS: Record<Role, string> = {
  admin: 'Manages people and project access, and can do everything an engineer can.',
  engineer: 'Creates projects, uploads models, runs and reviews checks.',
  viewer: 'Browses projects and results; changes nothing.',
};

export function canEdit(role: Role): boolean {
  return EDITING_ROLES.includes(role);
}
