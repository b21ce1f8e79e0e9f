import { z } from 'zod';
import { emailSchema, idSchema, isoDateTimeSchema } from './common';
import { siteRoleSchema, teamRoleSchema } from './roles';
import { plainText } from './text';

export const adminUserSchema = z.object({
  id: idSchema,
  email: z.string(),
  displayName: z.string(),
  siteRoles: z.array(siteRoleSchema),
  disabled: z.boolean(),
  createdAt: isoDateTimeSchema,
  teams: z.array(z.object({ id: idSchema, name: z.string(), role: teamRoleSchema })),
});
export type AdminUser = z.infer<typeof adminUserSchema>;
export const adminUserListSchema = z.object({ users: z.array(adminUserSchema) });

export const updateUserInputSchema = z
  .object({
    siteRoles: z.array(siteRoleSchema).optional(),
    disabled: z.boolean().optional(),
  })
  .refine((v) => v.siteRoles !== undefined || v.disabled !== undefined, {
    message: 'Give siteRoles or disabled.',
  });
export type UpdateUserInput = z.infer<typeof updateUserInputSchema>;
export const userParamsSchema = z.object({ userId: idSchema });

export const adminTeamSchema = z.object({
  id: idSchema,
  name: z.string(),
  slug: z.string(),
  memberCount: z.number().int(),
  createdAt: isoDateTimeSchema,
});
export type AdminTeam = z.infer<typeof adminTeamSchema>;
export const adminTeamListSchema = z.object({ teams: z.array(adminTeamSchema) });

export const createTeamInputSchema = z.object({
  name: plainText().trim().min(2).max(120),
  /** First team admin, invited by e-mail. */
  adminEmail: emailSchema,
});
export type CreateTeamInput = z.infer<typeof createTeamInputSchema>;

/** A message kept by the development fake SMTP server. */
export const outboxMessageSchema = z.object({
  id: z.string(),
  receivedAt: isoDateTimeSchema,
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  text: z.string(),
});
export type OutboxMessage = z.infer<typeof outboxMessageSchema>;
export const outboxSchema = z.object({
  /** False when real SMTP is configured: then there is no outbox to read. */
  enabled: z.boolean(),
  messages: z.array(outboxMessageSchema),
});

export const auditEventSchema = z.object({
  id: idSchema,
  at: isoDateTimeSchema,
  action: z.string(),
  actorEmail: z.string().nullable(),
  ip: z.string().nullable(),
  detail: z.record(z.string(), z.unknown()),
});
export type AuditEvent = z.infer<typeof auditEventSchema>;
export const auditEventListSchema = z.object({ events: z.array(auditEventSchema) });
export const auditQuerySchema = z.object({
  limit: z.coerce.number().int().min(1).max(500).default(100),
  before: isoDateTimeSchema.optional(),
});

export const healthSchema = z.object({
  status: z.enum(['ok', 'degraded']),
  database: z.enum(['ok', 'down']),
  version: z.string(),
});
