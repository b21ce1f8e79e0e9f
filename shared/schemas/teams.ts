import { z } from 'zod';
import { emailSchema, idSchema, isoDateTimeSchema, newPasswordSchema } from './common';
import { teamRoleSchema } from './roles';
import { plainText } from './text';

export const teamSchema = z.object({
  id: idSchema,
  name: z.string(),
  slug: z.string(),
  createdAt: isoDateTimeSchema,
});
export type Team = z.infer<typeof teamSchema>;

export const teamMemberSchema = z.object({
  userId: idSchema,
  email: z.string(),
  displayName: z.string(),
  role: teamRoleSchema,
  joinedAt: isoDateTimeSchema,
});
export type TeamMember = z.infer<typeof teamMemberSchema>;

export const teamMemberListSchema = z.object({ members: z.array(teamMemberSchema) });

export const memberParamsSchema = z.object({ teamId: idSchema, userId: idSchema });

export const updateMemberInputSchema = z.object({ role: teamRoleSchema });
export type UpdateMemberInput = z.infer<typeof updateMemberInputSchema>;

export const invitationSchema = z.object({
  id: idSchema,
  email: z.string(),
  role: teamRoleSchema,
  invitedBy: z.string(),
  createdAt: isoDateTimeSchema,
  expiresAt: isoDateTimeSchema,
  acceptedAt: isoDateTimeSchema.nullable(),
});
export type Invitation = z.infer<typeof invitationSchema>;

export const invitationListSchema = z.object({ invitations: z.array(invitationSchema) });

export const createInvitationInputSchema = z.object({
  email: emailSchema,
  role: teamRoleSchema,
});
export type CreateInvitationInput = z.infer<typeof createInvitationInputSchema>;

export const invitationParamsSchema = z.object({ teamId: idSchema, invitationId: idSchema });

/** What an invitee sees before accepting (public, by token). */
export const invitationPreviewSchema = z.object({
  teamName: z.string(),
  email: z.string(),
  role: teamRoleSchema,
  expiresAt: isoDateTimeSchema,
  /** True when an account with this e-mail exists: then accepting needs a sign-in, not a new password. */
  accountExists: z.boolean(),
});
export type InvitationPreview = z.infer<typeof invitationPreviewSchema>;

export const invitationTokenParamsSchema = z.object({ token: z.string().min(20).max(200) });

/** Accepting: a new account gives a display name and password; an existing one must be signed in. */
export const acceptInvitationInputSchema = z.object({
  displayName: plainText().trim().min(1).max(120).optional(),
  password: newPasswordSchema.optional(),
});
export type AcceptInvitationInput = z.infer<typeof acceptInvitationInputSchema>;
