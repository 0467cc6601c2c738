import { z } from 'zod';
import { displayNameSchema, emailSchema, labNameSchema, passwordSchema, userSchema } from './auth';
import { labRoleSchema } from './roles';

/** GET /api/labs/:labId */
export const labSchema = z.object({
  id: z.uuid(),
  name: z.string(),
  createdAt: z.iso.datetime(),
  myRole: labRoleSchema,
});
export type LabDetail = z.infer<typeof labSchema>;

/** POST /api/labs and PATCH /api/labs/:labId */
export const labInputSchema = z.object({ name: labNameSchema });
export type LabInput = z.infer<typeof labInputSchema>;

/** GET /api/labs/:labId/members */
export const memberSchema = z.object({
  membershipId: z.uuid(),
  userId: z.uuid(),
  email: z.string(),
  displayName: z.string(),
  role: labRoleSchema,
  joinedAt: z.iso.datetime(),
});
export type Member = z.infer<typeof memberSchema>;
export const membersSchema = z.array(memberSchema);

/** PATCH /api/labs/:labId/members/:membershipId */
export const changeRoleSchema = z.object({ role: labRoleSchema });
export type ChangeRole = z.infer<typeof changeRoleSchema>;

/** POST /api/labs/:labId/invitations */
export const inviteSchema = z.object({ email: emailSchema, role: labRoleSchema });
export type Invite = z.infer<typeof inviteSchema>;

/** GET /api/labs/:labId/invitations: the pending ones. */
export const invitationSchema = z.object({
  id: z.uuid(),
  email: z.string(),
  role: labRoleSchema,
  invitedBy: z.string().nullable(),
  sentAt: z.iso.datetime(),
  expiresAt: z.iso.datetime(),
});
export type Invitation = z.infer<typeof invitationSchema>;
export const invitationsSchema = z.array(invitationSchema);

/** GET /api/invitations/:token: what the person following the link is invited to. */
export const invitationPreviewSchema = z.object({
  labName: z.string(),
  role: labRoleSchema,
  email: z.string(),
  /** True when the address already has an account: accepting asks for its password instead of a new one. */
  hasAccount: z.boolean(),
});
export type InvitationPreview = z.infer<typeof invitationPreviewSchema>;

/**
 * POST /api/invitations/:token/accept. For a new account the password must meet the password rule and a
 * display name is needed; for an existing account the password is that account's own.
 */
export const acceptInvitationSchema = z.object({
  password: z.string().min(1, { error: 'Enter a password' }).max(200),
  displayName: displayNameSchema.optional(),
});
export const acceptInvitationNewAccountSchema = z.object({ password: passwordSchema, displayName: displayNameSchema });
export type AcceptInvitation = z.infer<typeof acceptInvitationSchema>;

/** GET /api/labs/:labId/outbox: mails the local fake SMTP server received (embedded mail mode only). */
export const outboxMailSchema = z.object({
  id: z.uuid(),
  receivedAt: z.iso.datetime(),
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  text: z.string(),
});
export type OutboxMail = z.infer<typeof outboxMailSchema>;
export const outboxSchema = z.array(outboxMailSchema);

/** The answer of accepting an invitation: the person is signed in, and a member of the lab. */
export const acceptedInvitationSchema = z.object({ user: userSchema, labId: z.uuid() });
