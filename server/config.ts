import { z } from 'zod';

// Environment validated once at boot, so a typo fails with a message instead of at first use.
const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  PORT: z.coerce.number().int().min(1).max(65535).default(5173),
  HOST: z.string().default('127.0.0.1'),
  DATABASE_URL: z.string().url({ message: 'DATABASE_URL must be a postgres:// URL' }),
  SESSION_SECRET: z.string().min(16).default('tapline-development-session-secret-change-me'),
  PUBLIC_URL: z.string().url().optional(),
  GITHUB_CLIENT_ID: z.string().optional(),
  GITHUB_CLIENT_SECRET: z.string().optional(),
  SMTP_HOST: z.string().optional(),
  SMTP_PORT: z.coerce.number().int().optional(),
  SMTP_FROM: z.string().default('Tapline <no-reply@tapline.local>'),
  TAPLINE_STATIC_DIR: z.string().optional(),
});

export type Config = z.infer<typeof envSchema>;

export class ConfigError extends Error {}

/** Reads and validates the process environment (or a given object, for tests). */
export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const parsed = envSchema.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new ConfigError(`Invalid configuration:\n${lines.join('\n')}`);
  }
  if (parsed.data.NODE_ENV === 'production' && parsed.data.SESSION_SECRET.startsWith('tapline-development')) {
    throw new ConfigError('SESSION_SECRET must be set to a long random string in production.');
  }
  return parsed.data;
}
