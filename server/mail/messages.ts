import type { MailMessage } from './mailer';

// The wording of every e-mail the server sends, in one place.

export function invitationMail(args: {
  to: string;
  teamName: string;
  inviterName: string;
  role: string;
  link: string;
  expiresAt: Date;
}): MailMessage {
  return {
    to: args.to,
    subject: `You are invited to ${args.teamName} on Thermoledger`,
    text: [
      `${args.inviterName} invited you to join ${args.teamName} on Thermoledger as ${args.role}.`,
      '',
      'Open this link to accept:',
      args.link,
      '',
      `The link works once and until ${args.expiresAt.toUTCString()}.`,
      'If you did not expect this, ignore this message.',
    ].join('\n'),
  };
}

export function passwordResetMail(args: { to: string; link: string; minutes: number }): MailMessage {
  return {
    to: args.to,
    subject: 'Reset your Thermoledger password',
    text: [
      'Someone (hopefully you) asked to reset the password of this Thermoledger account.',
      '',
      'Open this link to choose a new password:',
      args.link,
      '',
      `The link works once, within ${args.minutes} minutes. Choosing a new password signs the account out everywhere and revokes all its API tokens; scripts need a new token afterwards.`,
      '',
      'If you did not ask, ignore this message; your password stays as it is.',
    ].join('\n'),
  };
}

export function setLinkMail(args: {
  to: string;
  senderName: string;
  setTitle: string;
  link: string;
  expiresAt: Date | null;
}): MailMessage {
  return {
    to: args.to,
    subject: `${args.senderName} shared "${args.setTitle}" with you on Thermoledger`,
    text: [
      `${args.senderName} shared a reaction set with you: ${args.setTitle}.`,
      '',
      'Open this link to read it (no account needed; it is read-only):',
      args.link,
      '',
      args.expiresAt
        ? `The link works until ${args.expiresAt.toUTCString()}, unless it is revoked sooner.`
        : 'The link works until it is revoked.',
      'Anyone with the link can read the set, so forward it only to people who should.',
    ].join('\n'),
  };
}
