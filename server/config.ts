import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { z } from 'zod';
import { loadMailConfig, testMailConfig, type MailConfig } from './modules/mail/mail-config';

const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  HOST: z.string().default('127.0.0.1'),
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  DATA_DIR: z.string().default('data'),
  DATABASE_PATH: z.string().optional(),
  JWT_SECRET: z.string().min(32, 'must be at least 32 characters (256 bits)').optional(),
  SESSION_HOURS: z.coerce.number().positive().max(24 * 30).default(12),
  /** Extra origins allowed to make state-changing requests, comma separated. */
  APP_ORIGINS: z.string().default(''),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  SEED_DEMO: z.enum(['true', 'false']).optional(),
  LOGIN_MAX_ATTEMPTS: z.coerce.number().int().positive().default(10),
  LOGIN_WINDOW_MINUTES: z.coerce.number().positive().default(15),
  /** Where photos go: `disk` (DATA_DIR/files, the default) or `s3` (S3-compatible object storage). */
  STORAGE: z.enum(['disk', 's3']).default('disk'),
  S3_ENDPOINT: z.url().optional(),
  S3_BUCKET: z.string().min(3).max(63).optional(),
  S3_REGION: z.string().min(1).default('us-east-1'),
  S3_ACCESS_KEY_ID: z.string().min(1).optional(),
  S3_SECRET_ACCESS_KEY: z.string().min(1).optional(),
  /** Largest photo accepted, in megabytes (MiB). */
  PHOTO_MAX_MB: z.coerce.number().positive().max(200).default(15),
  /** Largest photo accepted, in megapixels (decoded size is checked from the header first). */
  PHOTO_MAX_MEGAPIXELS: z.coerce.number().positive().max(500).default(50),
  /** Photo uploads read at once; more wait their turn with their bodies unread. */
  PHOTO_UPLOAD_CONCURRENCY: z.coerce.number().int().min(1).max(64).default(4),
});

/** Where uploaded files are kept. */
export type StorageConfig =
  | { kind: 'disk' }
  | { kind: 's3'; endpoint: string | null; bucket: string; region: string; accessKeyId: string | null; secretAccessKey: string | null };

/** Settings the server runs with, checked at start. */
export interface AppConfig {
  env: 'development' | 'production' | 'test';
  host: string;
  port: number;
  dataDir: string;
  databasePath: string;
  jwtSecret: string;
  sessionHours: number;
  appOrigins: string[];
  logLevel: string;
  seedDemo: boolean;
  loginMaxAttempts: number;
  loginWindowMinutes: number;
  /** Outgoing mail: SMTP server, From address, the development catcher (server/modules/mail/mail-config.ts). */
  mail: MailConfig;
  storage: StorageConfig;
  /** Upload limits for photos: bytes per file and decoded pixels per image. */
  photoMaxBytes: number;
  photoMaxPixels: number;
  photoUploadConcurrency: number;
}

export class ConfigError extends Error {}

/**
 * Read the environment. Production refuses to start without JWT_SECRET; elsewhere a random
 * key is made once and kept in the data folder, so sessions survive a restart.
 */
export function loadConfig(env: NodeJS.ProcessEnv = process.env): AppConfig {
  const parsed = envSchema.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new ConfigError(`Invalid environment:\n${lines.join('\n')}`);
  }
  const e = parsed.data;
  const dataDir = resolve(e.DATA_DIR);
  let jwtSecret = e.JWT_SECRET;
  if (!jwtSecret) {
    if (e.NODE_ENV === 'production') {
      throw new ConfigError('JWT_SECRET is required in production: set at least 32 random characters (openssl rand -hex 32).');
    }
    jwtSecret = localSecret(dataDir);
  }
  return {
    env: e.NODE_ENV,
    host: e.HOST,
    port: e.PORT,
    dataDir,
    databasePath: e.DATABASE_PATH ?? join(dataDir, 'threadline.sqlite'),
    jwtSecret,
    sessionHours: e.SESSION_HOURS,
    appOrigins: e.APP_ORIGINS.split(',').map((s) => s.trim()).filter(Boolean),
    logLevel: e.LOG_LEVEL,
    seedDemo: e.SEED_DEMO ? e.SEED_DEMO === 'true' : e.NODE_ENV !== 'production',
    loginMaxAttempts: e.LOGIN_MAX_ATTEMPTS,
    loginWindowMinutes: e.LOGIN_WINDOW_MINUTES,
    mail: mailConfigOf(env, e.NODE_ENV),
    storage: storageConfig(e),
    photoMaxBytes: Math.round(e.PHOTO_MAX_MB * 1024 * 1024),
    photoMaxPixels: Math.round(e.PHOTO_MAX_MEGAPIXELS * 1_000_000),
    photoUploadConcurrency: e.PHOTO_UPLOAD_CONCURRENCY,
  };
}

function storageConfig(e: z.infer<typeof envSchema>): StorageConfig {
  if (e.STORAGE === 'disk') return { kind: 'disk' };
  if (!e.S3_BUCKET) throw new ConfigError('STORAGE=s3 needs S3_BUCKET (and S3_ENDPOINT for a non-AWS service).');
  if (Boolean(e.S3_ACCESS_KEY_ID) !== Boolean(e.S3_SECRET_ACCESS_KEY)) {
    throw new ConfigError('Set both S3_ACCESS_KEY_ID and S3_SECRET_ACCESS_KEY, or neither (to use the SDK\'s own credential chain).');
  }
  return {
    kind: 's3',
    endpoint: e.S3_ENDPOINT ?? null,
    bucket: e.S3_BUCKET,
    region: e.S3_REGION,
    accessKeyId: e.S3_ACCESS_KEY_ID ?? null,
    secretAccessKey: e.S3_SECRET_ACCESS_KEY ?? null,
  };
}

function mailConfigOf(env: NodeJS.ProcessEnv, nodeEnv: AppConfig['env']): MailConfig {
  try {
    return loadMailConfig(env, nodeEnv);
  } catch (err) {
    throw new ConfigError((err as Error).message);
  }
}

function localSecret(dataDir: string): string {
  const file = join(dataDir, 'session-key');
  if (existsSync(file)) return readFileSync(file, 'utf8').trim();
  mkdirSync(dataDir, { recursive: true });
  const secret = randomBytes(32).toString('hex');
  writeFileSync(file, secret, { mode: 0o600 });
  return secret;
}

/** A configuration for tests: in-memory database, fixed random key, quiet logs. */
export function testConfig(overrides: Partial<AppConfig> = {}): AppConfig {
  return {
    env: 'test',
    host: '127.0.0.1',
    port: 0,
    dataDir: join(process.cwd(), 'data', 'test'),
    databasePath: ':memory:',
    jwtSecret: randomBytes(32).toString('hex'),
    sessionHours: 12,
    appOrigins: [],
    logLevel: process.env.TEST_LOG_LEVEL ?? 'silent',
    seedDemo: false,
    loginMaxAttempts: 1000,
    loginWindowMinutes: 15,
    mail: testMailConfig(),
    storage: { kind: 'disk' },
    photoMaxBytes: 15 * 1024 * 1024,
    photoMaxPixels: 50_000_000,
    photoUploadConcurrency: 4,
    ...overrides,
  };
}
