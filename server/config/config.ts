import { z } from 'zod';

/** Session secret shipped for development only; production refuses to start with it. */
export const DEV_SESSION_SECRET = 'gaugeline-development-secret-change-me';

// 0 asks the OS for a free port (tests use it).
const port = z.coerce.number().int().min(0).max(65535);

const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  HOST: z.string().min(1).default('127.0.0.1'),
  PORT: port.default(8080),
  DB_HOST: z.string().min(1).default('127.0.0.1'),
  DB_PORT: port.default(3407),
  DB_NAME: z.string().regex(/^[A-Za-z0-9_]+$/, 'letters, digits and _ only').default('gaugeline'),
  DB_USER: z.string().min(1).default('gaugeline'),
  DB_PASSWORD: z.string().default(''),
  DB_POOL_MAX: z.coerce.number().int().min(1).max(200).default(10),
  SESSION_SECRET: z.string().min(16, 'must be at least 16 characters').default(DEV_SESSION_SECRET),
  SESSION_MAX_AGE_HOURS: z.coerce.number().positive().max(24 * 90).default(12),
  DATA_DIR: z.string().min(1).default('.data'),
  CLIENT_DIST: z.string().min(1).default('client/dist'),
  DEMO_SEED: z.enum(['on', 'off']).default('on'),
  /** With the demo seed: also queue the demo model (samples/) for import, with its forces table. */
  DEMO_MODELS: z.enum(['on', 'off']).default('on'),
  SIGN_IN_LIMIT: z.coerce.number().int().min(1).max(10_000).default(10),
  SIGN_IN_WINDOW_SECONDS: z.coerce.number().int().min(1).max(86_400).default(900),
  LOG_REQUESTS: z.enum(['on', 'off']).default('off'),
  UPLOAD_LIMIT_MB: z.coerce.number().positive().max(10_000).default(500),
  STORAGE: z.enum(['local', 's3']).default('local'),
  S3_ENDPOINT: z.string().url().optional(),
  S3_REGION: z.string().default('us-east-1'),
  S3_BUCKET: z.string().optional(),
  S3_ACCESS_KEY_ID: z.string().optional(),
  S3_SECRET_ACCESS_KEY: z.string().optional(),
  S3_FORCE_PATH_STYLE: z.enum(['on', 'off']).default('on'),
  IMPORT_WORKERS: z.coerce.number().int().min(0).max(16).default(1),
  IMPORT_TIME_LIMIT_SECONDS: z.coerce.number().int().min(1).max(24 * 3600).default(900),
  IMPORT_MEMORY_LIMIT_MB: z.coerce.number().int().min(64).max(65_536).default(4096),
  IMPORT_MAX_ATTEMPTS: z.coerce.number().int().min(1).max(10).default(2),
  IMPORT_POLL_MS: z.coerce.number().int().min(20).max(60_000).default(500),
  IMPORT_STALE_SECONDS: z.coerce.number().int().min(5).max(3600).default(60),
  ARCHIVE_INFLATE_LIMIT_MB: z.coerce.number().positive().max(100_000).default(2048),
  PUBLIC_URL: z.string().url().optional(),
  MAIL_FROM: z.string().min(3).default('Gaugeline <no-reply@gaugeline.invalid>'),
  SMTP_HOST: z.string().optional(),
  SMTP_PORT: port.optional(),
  SMTP_SECURE: z.enum(['on', 'off']).default('off'),
  SMTP_USER: z.string().optional(),
  SMTP_PASSWORD: z.string().optional(),
  MAIL_RETRY_SECONDS: z.coerce.number().int().min(1).max(86_400).default(30),
});

export interface AppConfig {
  env: 'development' | 'test' | 'production';
  host: string;
  port: number;
  db: { host: string; port: number; name: string; user: string; password: string; poolMax: number };
  session: { secret: string; maxAgeMs: number; secureCookie: boolean };
  dataDir: string;
  clientDist: string;
  demoSeed: boolean;
  demoModels: boolean;
  signInLimit: { max: number; windowMs: number };
  logRequests: boolean;
  uploads: { limitBytes: number; archiveInflateLimitBytes: number };
  storage:
    | { kind: 'local' }
    | { kind: 's3'; endpoint?: string; region: string; bucket: string; accessKeyId?: string; secretAccessKey?: string; forcePathStyle: boolean };
  /** Links in e-mails point here. */
  publicUrl: string;
  mail: {
    from: string;
    /** A real SMTP server, or null: then a local mail service on loopback keeps every message. */
    smtp: { host: string; port: number; secure: boolean; user?: string; password?: string } | null;
    retryMs: number;
  };
  imports: {
    /** Worker threads for import jobs; 0 disables the runner in this process (API-only node). */
    workers: number;
    timeLimitMs: number;
    memoryLimitMb: number;
    maxAttempts: number;
    pollMs: number;
    /** A claimed job whose heartbeat is older than this is taken over by another process. */
    staleMs: number;
  };
}

export class ConfigError extends Error {
  constructor(public readonly problems: string[]) {
    super(`Configuration is not valid:\n${problems.map((p) => `  - ${p}`).join('\n')}`);
    this.name = 'ConfigError';
  }
}

/**
 * Reads and validates the whole configuration once, at start-up. Every problem is
 * collected so a person can fix them all in one go, rather than one per restart.
 */
export function loadConfig(env: Record<string, string | undefined> = process.env): AppConfig {
  // Empty strings mean "unset" so that `PORT= npm start` falls back to the default.
  const cleaned = Object.fromEntries(Object.entries(env).filter(([, v]) => v !== undefined && v !== ''));
  const parsed = envSchema.safeParse(cleaned);
  if (!parsed.success) {
    throw new ConfigError(parsed.error.issues.map((i) => `${i.path.join('.') || 'environment'}: ${i.message}`));
  }
  const e = parsed.data;
  const problems: string[] = [];
  if (e.NODE_ENV === 'production') {
    if (e.SESSION_SECRET === DEV_SESSION_SECRET) problems.push('SESSION_SECRET: set a secret of your own in production');
    if (e.DEMO_SEED === 'on' && env.DEMO_SEED !== undefined) problems.push('DEMO_SEED: demo accounts are not allowed in production');
  }
  if (e.STORAGE === 's3') {
    if (!e.S3_BUCKET) problems.push('S3_BUCKET: required when STORAGE=s3');
    if (Boolean(e.S3_ACCESS_KEY_ID) !== Boolean(e.S3_SECRET_ACCESS_KEY)) problems.push('S3_ACCESS_KEY_ID / S3_SECRET_ACCESS_KEY: give both or neither');
  }
  if (e.NODE_ENV === 'production' && !e.SMTP_HOST) problems.push('SMTP_HOST: set the mail server to use in production');
  if (Boolean(e.SMTP_USER) !== Boolean(e.SMTP_PASSWORD)) problems.push('SMTP_USER / SMTP_PASSWORD: give both or neither');
  if (problems.length) throw new ConfigError(problems);
  return {
    env: e.NODE_ENV,
    host: e.HOST,
    port: e.PORT,
    db: { host: e.DB_HOST, port: e.DB_PORT, name: e.DB_NAME, user: e.DB_USER, password: e.DB_PASSWORD, poolMax: e.DB_POOL_MAX },
    session: { secret: e.SESSION_SECRET, maxAgeMs: e.SESSION_MAX_AGE_HOURS * 3_600_000, secureCookie: e.NODE_ENV === 'production' },
    dataDir: e.DATA_DIR,
    clientDist: e.CLIENT_DIST,
    // Production never seeds demo data, whatever DEMO_SEED says.
    demoSeed: e.NODE_ENV !== 'production' && e.DEMO_SEED === 'on',
    demoModels: e.DEMO_MODELS === 'on',
    signInLimit: { max: e.SIGN_IN_LIMIT, windowMs: e.SIGN_IN_WINDOW_SECONDS * 1000 },
    logRequests: e.LOG_REQUESTS === 'on',
    uploads: { limitBytes: Math.round(e.UPLOAD_LIMIT_MB * 1024 * 1024), archiveInflateLimitBytes: Math.round(e.ARCHIVE_INFLATE_LIMIT_MB * 1024 * 1024) },
    storage:
      e.STORAGE === 's3'
        ? {
            kind: 's3',
            endpoint: e.S3_ENDPOINT,
            region: e.S3_REGION,
            bucket: e.S3_BUCKET!,
            accessKeyId: e.S3_ACCESS_KEY_ID,
            secretAccessKey: e.S3_SECRET_ACCESS_KEY,
            forcePathStyle: e.S3_FORCE_PATH_STYLE === 'on',
          }
        : { kind: 'local' },
    publicUrl: (e.PUBLIC_URL ?? `http://${e.HOST}:${e.PORT}`).replace(/\/$/, ''),
    mail: {
      from: e.MAIL_FROM,
      smtp: e.SMTP_HOST
        ? { host: e.SMTP_HOST, port: e.SMTP_PORT ?? (e.SMTP_SECURE === 'on' ? 465 : 587), secure: e.SMTP_SECURE === 'on', user: e.SMTP_USER, password: e.SMTP_PASSWORD }
        : null,
      retryMs: e.MAIL_RETRY_SECONDS * 1000,
    },
    imports: {
      workers: e.IMPORT_WORKERS,
      timeLimitMs: e.IMPORT_TIME_LIMIT_SECONDS * 1000,
      memoryLimitMb: e.IMPORT_MEMORY_LIMIT_MB,
      maxAttempts: e.IMPORT_MAX_ATTEMPTS,
      pollMs: e.IMPORT_POLL_MS,
      staleMs: e.IMPORT_STALE_SECONDS * 1000,
    },
  };
}
