import { z } from 'zod';

/**
 * E-mail about amendments: which kinds there are, and how each user wants each kind — at once, in
 * a daily digest, or never.
 */
export const notificationKinds = ['amendment-opened', 'amendment-comment', 'amendment-decision'] as const;
export const notificationKindSchema = z.enum(notificationKinds);
export type NotificationKind = z.infer<typeof notificationKindSchema>;

export const notificationModes = ['immediate', 'daily', 'never'] as const;
export const notificationModeSchema = z.enum(notificationModes);
export type NotificationMode = z.infer<typeof notificationModeSchema>;

/** Plain words for each kind (who gets it). */
export const notificationKindLabels: Record<NotificationKind, string> = {
  'amendment-opened': 'An amendment enters the review queue (curators)',
  'amendment-comment': 'A comment on an amendment of yours',
  'amendment-decision': 'A decision on an amendment of yours (accepted, returned, declined)',
};

/** Every kind with its mode (defaults filled in). */
export const notificationSettingsSchema = z.object({
  settings: z.record(notificationKindSchema, notificationModeSchema),
});
export type NotificationSettings = z.infer<typeof notificationSettingsSchema>;

/** PATCH: only the kinds to change. */
export const notificationSettingsInputSchema = z
  .object({ settings: z.partialRecord(notificationKindSchema, notificationModeSchema) })
  .strict();
export type NotificationSettingsInput = z.infer<typeof notificationSettingsInputSchema>;

/** The default for a kind nobody chose a mode for. */
export const DEFAULT_NOTIFICATION_MODE: NotificationMode = 'immediate';
