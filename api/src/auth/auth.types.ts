import type { Request } from 'express';
import type { LabRole } from '@provenote/shared';

/** The signed-in person, as `@CurrentUser()` gives it. */
export interface AuthUser {
  id: string;
  email: string;
  displayName: string;
}

/** The signed-in person's place in the lab of a lab-scoped route, as `@CurrentMembership()` gives it. */
export interface LabMembership {
  labId: string;
  role: LabRole;
}

export interface AuthenticatedRequest extends Request {
  id?: string;
  user?: AuthUser;
  sessionId?: string;
  /** The double-submit CSRF token of this browser (issued by the guard when it had none). */
  csrfToken?: string;
  membership?: LabMembership;
}
