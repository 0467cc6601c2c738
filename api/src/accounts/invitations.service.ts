import { BadRequestException, ConflictException, Inject, Injectable, NotFoundException } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource, IsNull, MoreThan } from 'typeorm';
import {
  acceptInvitationNewAccountSchema,
  labRoleDescriptions,
  type AcceptInvitation,
  type Invitation as InvitationView,
  type InvitationPreview,
  type Invite,
} from '@provenote/shared';
import { AuditService } from '../audit/audit.service';
import type { AuthUser } from '../auth/auth.types';
import { hashPassword } from '../auth/passwords';
import { SignInService } from '../auth/sign-in.service';
import { hashSecret, newSecret } from '../auth/tokens';
import { APP_CONFIG } from '../config/config.module';
import type { AppConfig } from '../config/config';
import { MailService } from '../mail/mail.service';
import { RateLimitService } from '../rate-limit/rate-limit.service';
import { Invitation } from './invitation.entity';
import { Lab } from './lab.entity';
import { Membership } from './membership.entity';
import { User } from './user.entity';

export const INVITATION_TTL_MS = 7 * 24 * 60 * 60 * 1000;
export const INVITATION_NOT_VALID =
  'This invitation has expired, was revoked or was already used; ask the PI for a new one';
/** Invitation mails one lab may send per hour: plenty for a lab, too few to use Provenote for spam. */
export const INVITATIONS_PER_LAB_PER_HOUR = 30;

@Injectable()
export class InvitationsService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly mail: MailService,
    private readonly audit: AuditService,
    private readonly rateLimits: RateLimitService,
    private readonly signIn: SignInService,
    @Inject(APP_CONFIG) private readonly config: AppConfig,
  ) {}

  async pending(labId: string): Promise<InvitationView[]> {
    const rows = await this.dataSource.getRepository(Invitation).find({
      where: { labId, acceptedAt: IsNull(), revokedAt: IsNull() },
      relations: { invitedBy: true },
      order: { sentAt: 'DESC' },
    });
    return rows.map((row) => ({
      id: row.id,
      email: row.email,
      role: row.role,
      invitedBy: row.invitedBy?.displayName ?? null,
      sentAt: row.sentAt.toISOString(),
      expiresAt: row.expiresAt.toISOString(),
    }));
  }

  /** Invites, or re-invites with the new role when the address has a pending invitation already. */
  async invite(labId: string, { email, role }: Invite, actor: AuthUser): Promise<void> {
    await this.limit(labId);
    const member = await this.dataSource
      .getRepository(Membership)
      .exists({ where: { labId, user: { email } }, relations: { user: true } });
    if (member) throw new ConflictException(`${email} is already a member of this lab`);
    const repository = this.dataSource.getRepository(Invitation);
    const existing = await repository.findOne({ where: { labId, email, acceptedAt: IsNull(), revokedAt: IsNull() } });
    const invitation = existing ?? repository.create({ labId, email, invitedById: actor.id });
    invitation.role = role;
    const secret = this.renew(invitation);
    await this.dataSource.transaction(async (manager) => {
      await manager.save(invitation);
      await this.audit.record(
        {
          labId,
          actor,
          action: 'invitation.sent',
          target: { type: 'invitation', id: invitation.id },
          details: { email, role },
        },
        manager,
      );
    });
    await this.sendMail(invitation, secret, actor);
  }

  async resend(labId: string, invitationId: string, actor: AuthUser): Promise<void> {
    await this.limit(labId);
    const invitation = await this.findPending(labId, invitationId);
    const secret = this.renew(invitation);
    await this.dataSource.transaction(async (manager) => {
      await manager.save(invitation);
      await this.audit.record(
        {
          labId,
          actor,
          action: 'invitation.resent',
          target: { type: 'invitation', id: invitation.id },
          details: { email: invitation.email },
        },
        manager,
      );
    });
    await this.sendMail(invitation, secret, actor);
  }

  async revoke(labId: string, invitationId: string, actor: AuthUser): Promise<void> {
    const invitation = await this.findPending(labId, invitationId);
    await this.dataSource.transaction(async (manager) => {
      await manager.update(Invitation, { id: invitation.id }, { revokedAt: new Date() });
      await this.audit.record(
        {
          labId,
          actor,
          action: 'invitation.revoked',
          target: { type: 'invitation', id: invitation.id },
          details: { email: invitation.email },
        },
        manager,
      );
    });
  }

  async preview(secret: string): Promise<InvitationPreview> {
    const invitation = await this.dataSource.getRepository(Invitation).findOne({
      where: {
        tokenHash: hashSecret(secret),
        acceptedAt: IsNull(),
        revokedAt: IsNull(),
        expiresAt: MoreThan(new Date()),
      },
      relations: { lab: true },
    });
    if (!invitation) throw new NotFoundException(INVITATION_NOT_VALID);
    const user = await this.dataSource.getRepository(User).findOne({ where: { email: invitation.email } });
    return {
      labName: invitation.lab.name,
      role: invitation.role,
      email: invitation.email,
      hasAccount: Boolean(user?.passwordHash),
    };
  }

  /**
   * Joins the lab. An address with an account proves itself with that account's password; otherwise the
   * account is created (or completed) with the name and password given. Returns the person to sign in.
   */
  async accept(secret: string, body: AcceptInvitation, ip: string): Promise<{ user: AuthUser; labId: string }> {
    return this.dataSource.transaction(async (manager) => {
      const invitation = await manager
        .getRepository(Invitation)
        .createQueryBuilder('invitation')
        .setLock('pessimistic_write')
        .where('invitation.token_hash = :hash', { hash: hashSecret(secret) })
        .andWhere('invitation.accepted_at IS NULL AND invitation.revoked_at IS NULL AND invitation.expires_at > now()')
        .getOne();
      if (!invitation) throw new BadRequestException(INVITATION_NOT_VALID);
      const existing = await manager.findOne(User, { where: { email: invitation.email } });
      let user: AuthUser;
      if (existing?.passwordHash) {
        user = await this.signIn.verify({ email: invitation.email, password: body.password }, ip);
      } else {
        const account = acceptInvitationNewAccountSchema.parse(body);
        const passwordHash = await hashPassword(account.password);
        const saved = await manager.save(
          Object.assign(existing ?? manager.create(User, { email: invitation.email }), {
            displayName: account.displayName,
            passwordHash,
          }),
        );
        user = { id: saved.id, email: saved.email, displayName: saved.displayName };
      }
      await manager
        .createQueryBuilder()
        .insert()
        .into(Membership)
        .values({ labId: invitation.labId, userId: user.id, role: invitation.role })
        .orIgnore()
        .execute();
      await manager.update(Invitation, { id: invitation.id }, { acceptedAt: new Date() });
      await this.audit.record(
        {
          labId: invitation.labId,
          actor: user,
          action: 'member.joined',
          target: { type: 'user', id: user.id },
          details: { role: invitation.role, invitationId: invitation.id },
        },
        manager,
      );
      return { user, labId: invitation.labId };
    });
  }

  private renew(invitation: Invitation): string {
    const secret = newSecret();
    invitation.tokenHash = hashSecret(secret);
    invitation.sentAt = new Date();
    invitation.expiresAt = new Date(Date.now() + INVITATION_TTL_MS);
    return secret;
  }

  private async findPending(labId: string, invitationId: string): Promise<Invitation> {
    const invitation = await this.dataSource
      .getRepository(Invitation)
      .findOne({ where: { id: invitationId, labId, acceptedAt: IsNull(), revokedAt: IsNull() } });
    if (!invitation) throw new NotFoundException('No pending invitation with this id in this lab');
    return invitation;
  }

  private limit(labId: string) {
    return this.rateLimits.consume({
      key: `invitations:lab:${labId}`,
      limit: INVITATIONS_PER_LAB_PER_HOUR,
      windowSeconds: 3600,
    });
  }

  private async sendMail(invitation: Invitation, secret: string, actor: AuthUser) {
    const lab = await this.dataSource.getRepository(Lab).findOneByOrFail({ id: invitation.labId });
    const role = labRoleDescriptions[invitation.role];
    await this.mail.send({
      to: invitation.email,
      labId: invitation.labId,
      subject: `${actor.displayName} invites you to ${lab.name} on Provenote`,
      text: [
        `${actor.displayName} (${actor.email}) invites you to join the lab “${lab.name}” on Provenote as ${role.label.toLowerCase()}.`,
        `${role.label}: ${role.description}`,
        'To accept, open this link within 7 days (it works once):',
        `${this.config.PUBLIC_URL}/accept-invitation?token=${secret}`,
        'If you do not know this person, you can ignore this mail.',
      ].join('\n\n'),
    });
  }
}
