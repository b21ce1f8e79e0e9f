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

/** What happened to an amendment, for the e-mail to the people it concerns. */
export interface AmendmentNewsArgs {
  to: string;
  title: string;
  link: string;
  actorName: string;
  what: 'opened' | 'comment' | 'accepted' | 'returned' | 'declined';
  reason?: string | null;
  comment?: string | null;
  revision?: number | null;
}

/** One line of news (also a digest line). */
export function amendmentNewsLine(args: Omit<AmendmentNewsArgs, 'to' | 'link'>): string {
  switch (args.what) {
    case 'opened':
      return `${args.actorName} put “${args.title}” in the review queue.`;
    case 'comment':
      return `${args.actorName} commented on your amendment “${args.title}”.`;
    case 'accepted':
      return `${args.actorName} accepted your amendment “${args.title}”${args.revision ? `: it is library revision ${args.revision}` : ''}.`;
    case 'returned':
      return `${args.actorName} returned your amendment “${args.title}” with requests.`;
    case 'declined':
      return `${args.actorName} declined your amendment “${args.title}”.`;
  }
}

const newsSubjects: Record<AmendmentNewsArgs['what'], (title: string) => string> = {
  opened: (t) => `Amendment to review: ${t}`,
  comment: (t) => `New comment on your amendment: ${t}`,
  accepted: (t) => `Your amendment was accepted: ${t}`,
  returned: (t) => `Your amendment was returned: ${t}`,
  declined: (t) => `Your amendment was declined: ${t}`,
};

export function amendmentNewsMail(args: AmendmentNewsArgs): MailMessage {
  const quoted = args.comment ?? args.reason ?? null;
  return {
    to: args.to,
    subject: newsSubjects[args.what](args.title),
    text: [
      amendmentNewsLine(args),
      ...(quoted ? ['', ...quoted.split('\n').map((l) => `> ${l}`)] : []),
      '',
      'Open the amendment:',
      args.link,
      '',
      'You can choose which of these e-mails you get at once, in a daily digest, or not at all in your account settings.',
    ].join('\n'),
  };
}

/** The daily digest: one line and link per piece of news since the last digest. */
export function amendmentDigestMail(args: {
  to: string;
  items: { line: string; link: string }[];
  settingsLink: string;
}): MailMessage {
  return {
    to: args.to,
    subject: `Thermoledger: ${args.items.length} amendment update${args.items.length === 1 ? '' : 's'}`,
    text: [
      'What happened to amendments since your last digest:',
      '',
      ...args.items.flatMap((item) => [`- ${item.line}`, `  ${item.link}`]),
      '',
      `Change how you get these e-mails: ${args.settingsLink}`,
    ].join('\n'),
  };
}
