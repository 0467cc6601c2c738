import { createZodDto } from 'nestjs-zod';
import { acceptInvitationSchema, changeRoleSchema, inviteSchema, labInputSchema } from '@provenote/shared';

export class LabInputDto extends createZodDto(labInputSchema) {}
export class ChangeRoleDto extends createZodDto(changeRoleSchema) {}
export class InviteDto extends createZodDto(inviteSchema) {}
export class AcceptInvitationDto extends createZodDto(acceptInvitationSchema) {}
