import {
  type CanActivate,
  type ExecutionContext,
  ForbiddenException,
  Inject,
  Injectable,
  InternalServerErrorException,
  Logger,
  NotFoundException,
  UnauthorizedException,
} from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import { InjectRepository } from '@nestjs/typeorm';
import type { Response } from 'express';
import { Repository } from 'typeorm';
import type { LabRole } from '@provenote/shared';
import { Membership } from '../accounts/membership.entity';
import { APP_CONFIG } from '../config/config.module';
import type { AppConfig } from '../config/config';
import type { AuthenticatedRequest } from './auth.types';
import { IS_PUBLIC, LAB_ROLES, SIGNED_IN } from './roles.decorator';
import { CSRF_COOKIE, CSRF_HEADER, SESSION_COOKIE, issueCsrfCookie, setSessionCookie } from './session-cookies';
import { SessionService } from './session.service';
import { sameSecret } from './tokens';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);
const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** The one answer for "no such lab" and "not your lab", so a lab's existence is not revealed. */
export const LAB_NOT_FOUND = 'Lab not found';
export const NO_ACCESS_RULE = 'This route declares no access rule';

export type AccessRule =
  { kind: 'public' } | { kind: 'signed-in' } | { kind: 'roles'; roles: LabRole[] } | { kind: 'none' };

/** The access rule a handler declares; shared with the test that checks every route. */
// eslint-disable-next-line @typescript-eslint/no-unsafe-function-type -- Reflector's own parameter type
export function accessRule(reflector: Reflector, targets: [Function, Function]): AccessRule {
  const roles = reflector.getAllAndOverride<LabRole[] | undefined>(LAB_ROLES, targets);
  if (roles) return { kind: 'roles', roles };
  if (reflector.getAllAndOverride<boolean>(SIGNED_IN, targets)) return { kind: 'signed-in' };
  if (reflector.getAllAndOverride<boolean>(IS_PUBLIC, targets)) return { kind: 'public' };
  return { kind: 'none' };
}

/**
 * The global guard: every route must say who may call it (`@Public()`, `@SignedIn()` or `@Roles(...)`);
 * a route that says nothing is refused, so forgetting the rule fails closed.
 */
@Injectable()
export class AccessGuard implements CanActivate {
  private readonly logger = new Logger(AccessGuard.name);

  constructor(
    private readonly reflector: Reflector,
    private readonly sessions: SessionService,
    @InjectRepository(Membership) private readonly memberships: Repository<Membership>,
    @Inject(APP_CONFIG) private readonly config: AppConfig,
  ) {}

  async canActivate(context: ExecutionContext): Promise<boolean> {
    if (context.getType() !== 'http') return true;
    const req = context.switchToHttp().getRequest<AuthenticatedRequest>();
    const res = context.switchToHttp().getResponse<Response>();
    const rule = accessRule(this.reflector, [context.getHandler(), context.getClass()]);
    if (rule.kind === 'none') {
      this.logger.error(`${req.method} ${req.path}: ${NO_ACCESS_RULE}; add @Public(), @SignedIn() or @Roles()`);
      throw new InternalServerErrorException(NO_ACCESS_RULE);
    }

    const csrfCookie: string | undefined = req.cookies?.[CSRF_COOKIE];
    req.csrfToken = csrfCookie ?? issueCsrfCookie(res, this.config);
    if (!SAFE_METHODS.has(req.method)) {
      const header = req.header(CSRF_HEADER);
      if (!csrfCookie || !header || !sameSecret(csrfCookie, header)) {
        throw new ForbiddenException('Missing or wrong CSRF token: send the provenote_csrf cookie as X-CSRF-Token');
      }
    }

    const token: string | undefined = req.cookies?.[SESSION_COOKIE];
    const session = token ? await this.sessions.resolve(token) : null;
    if (session) {
      req.user = session.user;
      req.sessionId = session.sessionId;
      if (session.renewedUntil && token) setSessionCookie(res, this.config, token, session.renewedUntil);
    }
    if (rule.kind === 'public') return true;
    if (!session) throw new UnauthorizedException('Please sign in');
    if (rule.kind === 'signed-in') return true;

    const labId = req.params?.labId;
    if (typeof labId !== 'string') {
      throw new InternalServerErrorException('@Roles() is for routes with a :labId parameter');
    }
    if (!UUID.test(labId)) throw new NotFoundException(LAB_NOT_FOUND);
    const membership = await this.memberships.findOne({ where: { labId, userId: session.user.id } });
    if (!membership) throw new NotFoundException(LAB_NOT_FOUND);
    req.membership = { labId, role: membership.role };
    if (!rule.roles.includes(membership.role)) {
      throw new ForbiddenException(`Your role in this lab (${membership.role}) may not do this`);
    }
    return true;
  }
}
