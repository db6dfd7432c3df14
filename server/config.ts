import { z } from 'zod';

const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  DATABASE_URL: z
    .string({ message: 'DATABASE_URL is required (the start script sets it)' })
    .regex(/^postgres(ql)?:\/\//, { message: 'DATABASE_URL must be a postgres:// URL' }),
  PORT: z.coerce.number().int().min(1).max(65535).default(3000),
  HOST: z.string().default('127.0.0.1'),
  /** Extra origins allowed to send state-changing requests, comma-separated. */
  ALLOWED_ORIGINS: z.string().default(''),
  /** Sign-in/sign-up attempts per client per 15 minutes. */
  AUTH_RATE_LIMIT: z.coerce.number().int().min(1).default(20),
  /** Set when a reverse proxy terminates TLS in front of the app. */
  TRUST_PROXY: z.enum(['0', '1']).default('0'),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'silent']).default('info'),
  SERVE_CLIENT: z.enum(['0', '1']).default('1'),
});

export type AppConfig = {
  env: 'development' | 'production' | 'test';
  databaseUrl: string;
  port: number;
  host: string;
  allowedOrigins: string[];
  authRateLimit: number;
  /** Key prefix for rate-limit counters; tests give each app its own. */
  rateLimitPrefix: string;
  trustProxy: boolean;
  logLevel: string;
  serveClient: boolean;
};

/** Parses the environment; exits with a clear message instead of starting half-configured. */
export function loadConfig(env: NodeJS.ProcessEnv = process.env): AppConfig {
  const parsed = envSchema.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    console.error(`Headroom cannot start; fix these settings:\n${lines.join('\n')}`);
    process.exit(1);
  }
  const e = parsed.data;
  return {
    env: e.NODE_ENV,
    databaseUrl: e.DATABASE_URL,
    port: e.PORT,
    host: e.HOST,
    allowedOrigins: e.ALLOWED_ORIGINS.split(',')
      .map((s) => s.trim())
      .filter(Boolean),
    authRateLimit: e.AUTH_RATE_LIMIT,
    rateLimitPrefix: 'auth:',
    trustProxy: e.TRUST_PROXY === '1',
    logLevel: e.LOG_LEVEL,
    serveClient: e.SERVE_CLIENT === '1',
  };
}
