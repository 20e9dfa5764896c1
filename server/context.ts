/** Everything services need besides the models: configuration, mail and file storage. */
import type { Sequelize } from 'sequelize';
import type { Mailer } from './mail/mailer.ts';
import type { ObjectStorage } from './storage/object-storage.ts';

/** Server configuration (no secrets are logged). */
export interface ServerConfig {
  /** HMAC secret for session tokens. */
  jwtSecret: string;
  /** Base URL used in mailed links, without trailing slash (e.g. http://127.0.0.1:4310). */
  publicUrl: string;
  /** Set the Secure flag on the session cookie (production behind HTTPS). */
  cookieSecure: boolean;
  /** bcrypt cost factor; at least 10. */
  bcryptCost: number;
  /** Session lifetime in seconds (default 7 days). */
  sessionSeconds: number;
}

/** Dependencies handed to every service call. */
export interface ServerContext {
  sequelize: Sequelize;
  mailer: Mailer;
  storage: ObjectStorage;
  config: ServerConfig;
}
