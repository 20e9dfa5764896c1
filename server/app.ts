/**
 * Builds the Express app (no listening; server/index.ts and the scripts do
 * that): helmet, JSON size limits, cookies, authentication, the Origin check,
 * every route under /api, one error handler, and the built client from
 * dist/ with an SPA fallback when dist/ exists.
 */
import { existsSync } from 'node:fs';
import path from 'node:path';
import cookieParser from 'cookie-parser';
import express, { type Express, type RequestHandler } from 'express';
import { rateLimit } from 'express-rate-limit';
import helmet from 'helmet';
import type { Sequelize } from 'sequelize';
import type { ServerConfig, ServerContext } from './context.ts';
import type { Outbox } from './fakes/smtp.ts';
import type { Mailer } from './mail/mailer.ts';
import { authenticate, checkOrigin } from './middleware/auth.ts';
import { errorHandler } from './middleware/errors.ts';
import { accountRoutes } from './routes/account.ts';
import { adminRoutes } from './routes/admin.ts';
import { authRoutes } from './routes/auth.ts';
import { commentRoutes } from './routes/comments.ts';
import { devRoutes } from './routes/dev.ts';
import { diffRoutes } from './routes/diff.ts';
import { exportRoutes } from './routes/exports.ts';
import { ExportQueue } from './services/exports/jobs.ts';
import { healthRoutes } from './routes/health.ts';
import { memberRoutes } from './routes/members.ts';
import { patternRoutes } from './routes/patterns.ts';
import { paymentsWebhookRoutes } from './routes/payments-webhook.ts';
import { shopRoutes } from './routes/shop.ts';
import { releaseRoutes } from './routes/releases.ts';
import { reviewRoutes } from './routes/review.ts';
import { uploadRoutes } from './routes/uploads.ts';
import { AppError } from './services/errors.ts';
import { createPayments, type PaymentsConfig } from './services/payments.ts';
import { createLocalStorage, type ObjectStorage } from './storage/object-storage.ts';

/** A rate limit: at most `limit` requests per `windowMs` from one client address. */
export interface RateLimitSetting { windowMs: number; limit: number }

/** Options of {@link createApp}. Only `sequelize`, `mailer` and `jwtSecret` are required. */
export interface AppOptions {
  sequelize: Sequelize;
  mailer: Mailer;
  /** HMAC secret for session tokens (from env JWT_SECRET or `.data/<name>/jwt-secret`). */
  jwtSecret: string;
  /** Folder for uploaded files (default `.data/start/uploads`). Ignored when `storage` is given. */
  storageDir?: string;
  storage?: ObjectStorage;
  /** Base URL for links in mails (default http://127.0.0.1:4310). */
  publicUrl?: string;
  /** Mails caught by the fake SMTP server, for GET /api/dev/outbox. */
  outbox?: Outbox | null;
  /** 'production' hides the dev routes and sets Secure cookies. Default: NODE_ENV, else 'development'. */
  env?: string;
  /** Folder of the built client; default `<repo>/dist`; null serves the API only. */
  distDir?: string | null;
  /** Per-route limits: sign-in, register and password reset. Defaults: 20, 10 and 10 per 15 minutes. */
  rateLimits?: Partial<Record<'login' | 'register' | 'reset', RateLimitSetting>>;
  /** Origins besides the app's own that may send cookie-authenticated unsafe requests. */
  allowedOrigins?: string[];
  /** bcrypt cost (default 12; values below 10 are raised to 10). */
  bcryptCost?: number;
  /** Session lifetime in seconds (default 7 days). */
  sessionSeconds?: number;
  /** Express `trust proxy` setting, for rate limits behind a load balancer (default false; env TRUST_PROXY in server/index.ts). */
  trustProxy?: boolean | number | string;
  /** Payment provider (the SDK's key, webhook secret, and host/port of a local stand-in); null or absent: the shop cannot sell (503). */
  payments?: PaymentsConfig | null;
}

const repoRoot = path.resolve(import.meta.dirname, '..');
const FIFTEEN_MINUTES = 15 * 60 * 1000;

function limiter(setting: RateLimitSetting): RequestHandler {
  return rateLimit({
    windowMs: setting.windowMs,
    limit: setting.limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, _res, next) => next(new AppError(429, 'rate-limited', 'Too many attempts from here. Wait a few minutes and try again.')),
  });
}

/** Builds the Express app. */
export function createApp(opts: AppOptions): Express {
  const env = opts.env ?? process.env.NODE_ENV ?? 'development';
  const isProduction = env === 'production';
  const config: ServerConfig = {
    jwtSecret: opts.jwtSecret,
    publicUrl: (opts.publicUrl ?? 'http://127.0.0.1:4310').replace(/\/+$/, ''),
    cookieSecure: isProduction,
    bcryptCost: Math.max(10, opts.bcryptCost ?? 12),
    sessionSeconds: opts.sessionSeconds ?? 7 * 24 * 3600,
  };
  const ctx: ServerContext = {
    sequelize: opts.sequelize,
    mailer: opts.mailer,
    storage: opts.storage ?? createLocalStorage(opts.storageDir ?? path.join(repoRoot, '.data', 'start', 'uploads')),
    config,
  };
  const limits = opts.rateLimits ?? {};
  const payments = opts.payments ? createPayments(opts.payments) : null;

  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', opts.trustProxy ?? false);
  app.use(helmet({
    contentSecurityPolicy: {
      useDefaults: true,
      // Plain http on loopback must not be upgraded; fonts and images are bundled.
      directives: { 'upgrade-insecure-requests': null, 'img-src': ["'self'", 'data:', 'blob:'], 'worker-src': ["'self'", 'blob:'] },
    },
    strictTransportSecurity: isProduction,
  }));
  // The payment webhook reads its raw body (the signature covers the exact bytes), so it comes before the JSON parser.
  app.use(paymentsWebhookRoutes(ctx, payments));
  // Sources are capped at 1 MiB by the service (413 with a clear message); leave room for JSON escaping.
  app.use('/api', express.json({ limit: '3mb' }));
  app.use(cookieParser());

  const api = express.Router();
  api.use(authenticate(ctx));
  api.use(checkOrigin(opts.allowedOrigins ?? (isProduction ? [] : ['http://localhost:5173', 'http://127.0.0.1:5173'])));
  api.use(healthRoutes(opts.sequelize));
  api.use(authRoutes(ctx, {
    login: limiter(limits.login ?? { windowMs: FIFTEEN_MINUTES, limit: 20 }),
    register: limiter(limits.register ?? { windowMs: FIFTEEN_MINUTES, limit: 10 }),
    reset: limiter(limits.reset ?? { windowMs: FIFTEEN_MINUTES, limit: 10 }),
  }));
  api.use(accountRoutes(ctx, limits.login));
  api.use(uploadRoutes(ctx));
  api.use(patternRoutes(ctx));
  api.use(memberRoutes(ctx));
  api.use(commentRoutes());
  api.use(shopRoutes(ctx, payments));
  api.use(reviewRoutes(ctx));
  api.use(releaseRoutes(ctx));
  // One worker thread per app for exports and diffs (started on first use).
  const workQueue = new ExportQueue();
  api.use(diffRoutes(workQueue));
  api.use(exportRoutes(workQueue));
  api.use(adminRoutes());
  if (env === 'development' || env === 'test') api.use(devRoutes(opts.outbox ?? null));
  api.use((req, _res, next) => next(new AppError(404, 'not-found', `There is no API route ${req.method} ${req.baseUrl}${req.path}.`)));
  app.use('/api', api);

  const distDir = opts.distDir === undefined ? path.join(repoRoot, 'dist') : opts.distDir;
  if (distDir && existsSync(path.join(distDir, 'index.html'))) {
    app.use(express.static(distDir, { index: false, maxAge: '1h' }));
    app.get('/{*splat}', (_req, res) => {
      res.setHeader('Cache-Control', 'no-cache');
      res.sendFile(path.join(distDir, 'index.html'));
    });
  }
  app.use(errorHandler);
  return app;
}
