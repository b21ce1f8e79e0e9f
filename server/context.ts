import type { SessionUser } from '@shared/schemas/session';
import type { AppConfig } from './env';
import type { Db } from './db/client';
import type { Mailer } from './mail/mailer';
import type { LibraryCache } from './library/snapshot';
import type { RateLimits } from './middleware/rate-limit';

/** Who made a request, once authenticated. Tokens carry their owner's roles. */
export interface Principal {
  user: SessionUser;
  via: 'session' | 'token';
  sessionId?: string;
  tokenId?: string;
}

/** What the request pipeline needs: built once per app by createApp. */
export interface AppDeps {
  db: Db;
  mailer: Mailer;
  config: AppConfig;
  limits: RateLimits;
  /** The library's snapshots per revision (in memory, shared by all requests). */
  library: LibraryCache;
}

/** Request metadata kept in the audit log. */
export interface RequestMeta {
  ip: string | null;
  userAgent: string | null;
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Locals {
      requestId: string;
      principal: Principal | null;
      /** True when the request presented the session cookie (valid or not). */
      cookieAuth: boolean;
    }
  }
}
