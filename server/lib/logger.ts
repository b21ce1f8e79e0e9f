import pino, { type DestinationStream, type Logger } from 'pino';
import type { AppConfig } from '../env';

/**
 * The server's structured logger (JSON lines on stdout). Tests pass `silent`, or their own
 * destination to read what was logged. Secrets never reach it: request URLs are logged without
 * their query string and with invitation tokens masked (see request-log.ts).
 */
export function createLogger(config: Pick<AppConfig, 'logLevel'>, destination?: DestinationStream): Logger {
  return pino(
    {
      level: config.logLevel,
      base: undefined,
      redact: { paths: ['req.headers.authorization', 'req.headers.cookie', 'res.headers["set-cookie"]'], remove: true },
    },
    destination,
  );
}
