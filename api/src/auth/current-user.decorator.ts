import { createParamDecorator, type ExecutionContext, InternalServerErrorException } from '@nestjs/common';
import type { AuthenticatedRequest, AuthUser, LabMembership } from './auth.types';

/** The signed-in person; only on routes marked `@SignedIn()` or `@Roles(...)`. */
export const CurrentUser = createParamDecorator((_data: unknown, context: ExecutionContext): AuthUser => {
  const user = context.switchToHttp().getRequest<AuthenticatedRequest>().user;
  if (!user) throw new InternalServerErrorException('@CurrentUser() used on a route without @SignedIn() or @Roles()');
  return user;
});

/** The signed-in person's lab and role; only on lab-scoped routes marked `@Roles(...)`. */
export const CurrentMembership = createParamDecorator((_data: unknown, context: ExecutionContext): LabMembership => {
  const membership = context.switchToHttp().getRequest<AuthenticatedRequest>().membership;
  if (!membership) throw new InternalServerErrorException('@CurrentMembership() used on a route without @Roles()');
  return membership;
});
