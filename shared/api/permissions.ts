import { ROLES, type Role } from '@shared/schemas/auth';

/** Who passes an access check: nobody is turned away, any signed-in user, or the roles listed. */
export type Access = 'anyone' | 'signedIn' | readonly Role[];

/**
 * The one permission table: the server's role checks, the access-matrix test, the side navigation and the
 * buttons all read it. Add a permission here rather than writing a role list anywhere else.
 */
export const PERMISSIONS = {
  anyone: 'anyone',
  signedIn: 'signedIn',
  /** Browse and use the design library: designs, materials, cores, comparisons. */
  library: ['engineer', 'reviewer', 'admin'],
  /** Own designs: create, copy, import, revise, submit. */
  design: ['engineer', 'reviewer'],
  /** Add materials and cores (one at a time or from a CSV file) and edit them. */
  upload: ['engineer', 'reviewer', 'admin'],
  /** Retire and bring back materials and cores. */
  curate: ['reviewer', 'admin'],
  /** Approve, return and release revisions. */
  review: ['reviewer'],
  /** Read build orders and winding sheets. */
  shop: ['winder', 'reviewer', 'engineer', 'admin'],
  /** Record built units. */
  build: ['winder'],
  /** Void a unit record with a reason: winders their own records (checked in the service), reviewers and admins any. */
  voidUnit: ['winder', 'reviewer', 'admin'],
  /** Void any unit record, whoever recorded it. */
  voidAnyUnit: ['reviewer', 'admin'],
  /** Measured against predicted figures. */
  predictionReport: ['engineer', 'reviewer', 'admin'],
  /** Accounts, audit log, outbox, settings. */
  admin: ['admin'],
} as const satisfies Record<string, Access>;

export type Permission = keyof typeof PERMISSIONS;

/** The roles a permission lets in (every role for "anyone" and "signedIn"). */
export function rolesFor(permission: Permission): readonly Role[] {
  const access: Access = PERMISSIONS[permission];
  return typeof access === 'string' ? ROLES : access;
}

/** May a user with this role (null: not signed in) do what the permission guards? */
export function may(role: Role | null, permission: Permission): boolean {
  const access: Access = PERMISSIONS[permission];
  if (access === 'anyone') return true;
  if (role === null) return false;
  return access === 'signedIn' || access.includes(role);
}
