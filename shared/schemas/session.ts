import { z } from 'zod';
import { emailSchema, idSchema } from './common';
import { siteRoleSchema, teamRoleSchema } from './roles';

export const signInInputSchema = z.object({
  email: emailSchema,
  password: z.string().min(1, 'Enter your password.').max(200),
});
export type SignInInput = z.infer<typeof signInInputSchema>;

export const sessionUserSchema = z.object({
  id: idSchema,
  email: z.string(),
  displayName: z.string(),
  siteRoles: z.array(siteRoleSchema),
});
export type SessionUser = z.infer<typeof sessionUserSchema>;

export const teamMembershipSchema = z.object({
  id: idSchema,
  name: z.string(),
  slug: z.string(),
  role: teamRoleSchema,
});
export type TeamMembership = z.infer<typeof teamMembershipSchema>;

/** Who is signed in (user null when nobody), with their teams and roles. */
export const sessionInfoSchema = z.object({
  user: sessionUserSchema.nullable(),
  teams: z.array(teamMembershipSchema),
  /** How the request was authenticated. */
  via: z.enum(['session', 'token', 'none']),
});
export type SessionInfo = z.infer<typeof sessionInfoSchema>;
