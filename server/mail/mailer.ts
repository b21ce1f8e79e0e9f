import nodemailer from 'nodemailer';
import type { Outbox } from './fake-smtp';

/** One plain-text e-mail. */
export interface MailMessage {
  to: string;
  subject: string;
  text: string;
}

/** What the app needs from mail: sending, and (with the fake server) reading what was sent. */
export interface Mailer {
  send(message: MailMessage): Promise<void>;
  /** The development outbox; null when real SMTP is configured. */
  outbox: Outbox | null;
}

export interface SmtpSettings {
  host: string;
  port: number;
  secure: boolean;
  user?: string | undefined;
  pass?: string | undefined;
  from: string;
}

/** A nodemailer-backed mailer; pass the fake server's outbox when sending to it. */
export function createMailer(smtp: SmtpSettings, outbox: Outbox | null): Mailer {
  const transport = nodemailer.createTransport({
    host: smtp.host,
    port: smtp.port,
    secure: smtp.secure,
    // The local fake speaks plain SMTP only.
    ignoreTLS: outbox !== null,
    auth: smtp.user ? { user: smtp.user, pass: smtp.pass ?? '' } : undefined,
  });
  return {
    outbox,
    async send(message) {
      await transport.sendMail({ from: smtp.from, to: message.to, subject: message.subject, text: message.text });
    },
  };
}
