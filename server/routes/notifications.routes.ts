import { notificationSettingsInputSchema, notificationSettingsSchema } from '@shared/schemas/notifications';
import { requireActor } from '../context';
import { getNotificationSettings, updateNotificationSettings } from '../services/notifications.service';
import { defineRoute } from './registry';

const kinds =
  'Kinds: amendment-opened (curators: an amendment enters the review queue), amendment-comment (a comment on your amendment), amendment-decision (your amendment accepted, returned or declined). Modes: immediate, daily (one digest a day), never.';

/** Each user's choice of e-mail about amendments. */
export const notificationRoutes = [
  defineRoute({
    method: 'get',
    path: '/account/notifications',
    summary: 'How the caller gets each kind of e-mail',
    description: kinds,
    tags: ['account'],
    access: 'signed_in',
    responses: { 200: notificationSettingsSchema },
    handler: ({ ctx }) => getNotificationSettings(requireActor(ctx), {}),
  }),
  defineRoute({
    method: 'patch',
    path: '/account/notifications',
    summary: 'Change how the caller gets some kinds of e-mail',
    description: `Only the kinds given change. ${kinds}`,
    tags: ['account'],
    access: 'signed_in',
    request: { body: notificationSettingsInputSchema },
    responses: { 200: notificationSettingsSchema },
    handler: ({ ctx, body }) => updateNotificationSettings(requireActor(ctx), body),
  }),
];
