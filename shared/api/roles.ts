/** Account roles. admin: people and projects; engineer: upload, check, override, export; viewer: browse only. */
export const ROLES = ['admin', 'engineer', 'viewer'] as const;
export type Role = (typeof ROLES)[number];

/** Roles that may create projects and change engineering inputs. */
export const EDITING_ROLES: readonly Role[] = ['admin', 'engineer'];
