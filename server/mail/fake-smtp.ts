import { randomUUID } from 'node:crypto';
import type { AddressInfo } from 'node:net';
import { SMTPServer } from 'smtp-server';
import type { OutboxMessage } from '@shared/schemas/admin';
import { parseMessage } from './parse-message';

/** Messages kept by the fake SMTP server, newest last. */
export interface Outbox {
  list(): OutboxMessage[];
  clear(): void;
}

/** A running local SMTP server that accepts everything and keeps it in memory. */
export interface FakeSmtp extends Outbox {
  host: string;
  port: number;
  close(): Promise<void>;
}

/**
 * Starts a development SMTP server on `host:port` (port 0 = any free port). It keeps the last
 * `limit` messages, parsed, so the admin outbox and tests can read e-mailed links.
 */
export async function startFakeSmtp(options: { host?: string; port?: number; limit?: number } = {}): Promise<FakeSmtp> {
  const host = options.host ?? '127.0.0.1';
  const limit = options.limit ?? 500;
  const messages: OutboxMessage[] = [];
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    size: 2 * 1024 * 1024,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('error', callback);
      stream.on('end', () => {
        const parsed = parseMessage(Buffer.concat(chunks).toString('utf8'));
        const from = session.envelope.mailFrom;
        messages.push({
          id: randomUUID(),
          receivedAt: new Date().toISOString(),
          from: from ? from.address : '',
          to: session.envelope.rcptTo.map((r) => r.address),
          subject: parsed.subject,
          text: parsed.text,
        });
        if (messages.length > limit) messages.splice(0, messages.length - limit);
        callback();
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.server.once('error', reject);
    server.listen(options.port ?? 2525, host, () => resolve());
  });
  const port = (server.server.address() as AddressInfo).port;
  return {
    host,
    port,
    list: () => [...messages],
    clear: () => void messages.splice(0),
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
