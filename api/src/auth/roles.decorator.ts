import { SetMetadata } from '@nestjs/common';
import { labRoles, type LabRole } from '@provenote/shared';

export { Public, IS_PUBLIC } from '../common/public.decorator';

export const LAB_ROLES = 'provenote:lab-roles';
export const SIGNED_IN = 'provenote:signed-in';

/** Every role: for lab-scoped routes any member may call (reading a study, say). */
export const ANY_LAB_ROLE: readonly LabRole[] = labRoles;

/**
 * A lab-scoped route (its path has `:labId`) that only members holding one of these roles may call.
 * Not signed in → 401; not a member of that lab, or no such lab → 404; member with another role → 403.
 */
export const Roles = (...roles: LabRole[]) => {
  if (roles.length === 0) throw new Error('@Roles() needs at least one role; use @SignedIn() or @Public()');
  return SetMetadata(LAB_ROLES, roles);
};

/** A route that needs a session but belongs to no lab (the person's own profile, creating a lab). */
export const SignedIn = () => SetMetadata(SIGNED_IN, true);
