// Who may do what (DESIGN 1): the one table that endpoints, pages, services and islands consult.
// Endpoints enforce it (src/server/http.ts `requirePermission`); pages and islands only use it to
// hide what a role cannot do.

export const roles = ['technician', 'engineer', 'qa', 'admin'] as const;
export type Role = (typeof roles)[number];

const everyone = roles;

export const permissions = {
  /** see tests, vessels, materials, results, plots and exports */
  read: everyone,
  /** upload logs, start reductions, add test notes (QA only reads) */
  upload: ['technician', 'engineer', 'admin'],
  /** create and edit vessels, materials, tests and plans */
  plan: ['engineer', 'admin'],
  /** disposition flagged gauges */
  disposition: ['engineer', 'admin'],
  /** sign the engineering review: a person's own act, never an admin's on their behalf */
  review: ['engineer'],
  /** release a reviewed test (locks it): likewise QA's own act */
  release: ['qa'],
  /** create and revoke inspector share links */
  share: ['qa', 'admin'],
  /** read the audit trail and the outbox */
  audit: ['qa', 'admin'],
  /** manage accounts and roles */
  users: ['admin'],
} as const satisfies Record<string, readonly Role[]>;

export type Permission = keyof typeof permissions;

export function isRole(value: unknown): value is Role {
  return typeof value === 'string' && (roles as readonly string[]).includes(value);
}

/** Whether `role` may do `permission`; unknown or missing roles may do nothing. */
export function can(role: string | null | undefined, permission: Permission): boolean {
  return isRole(role) && (permissions[permission] as readonly Role[]).includes(role);
}

/** The roles that hold a permission, for messages ("needs engineer or admin"). */
export function rolesFor(permission: Permission): readonly Role[] {
  return permissions[permission];
}
