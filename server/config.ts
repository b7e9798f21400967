import { z } from 'zod';

const flag = z.enum(['0', '1', 'true', 'false']).transform((v) => v === '1' || v === 'true');

// Environment validated once at boot, so a typo fails with a message instead of at first use.
const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  PORT: z.coerce.number().int().min(1).max(65535).default(5173),
  HOST: z.string().default('127.0.0.1'),
  DATABASE_URL: z.string().url({ message: 'DATABASE_URL must be a postgres:// URL' }),
  SESSION_SECRET: z.string().min(16).default('tapline-development-session-secret-change-me'),
  /** Origin the app is reached at, e.g. https://tapline.example.org; used in e-mailed links and the OAuth callback. */
  PUBLIC_URL: z.string().url().optional(),
  GITHUB_CLIENT_ID: z.string().min(1).optional(),
  GITHUB_CLIENT_SECRET: z.string().min(1).optional(),
  /** Lets the fake OAuth provider run with NODE_ENV=production (a demo box); never on a real deployment. */
  TAPLINE_ALLOW_FAKE_OAUTH: flag.default(false),
  SMTP_HOST: z.string().min(1).optional(),
  SMTP_PORT: z.coerce.number().int().min(1).max(65535).default(587),
  SMTP_SECURE: flag.default(false),
  SMTP_USER: z.string().optional(),
  SMTP_PASS: z.string().optional(),
  SMTP_FROM: z.string().default('Tapline <no-reply@tapline.local>'),
  /** Sign-in attempts allowed per client address in 15 minutes. */
  RATE_LIMIT_SIGNIN: z.coerce.number().int().min(1).default(30),
  /** Invitations one user may send per hour. */
  RATE_LIMIT_INVITATIONS: z.coerce.number().int().min(1).default(20),
  /** Days an invitation link stays valid. */
  INVITATION_DAYS: z.coerce.number().min(0.001).default(7),
  TAPLINE_STATIC_DIR: z.string().optional(),
});

export type Config = z.infer<typeof envSchema>;

export class ConfigError extends Error {}

/** True when a hosted GitHub OAuth app is configured; otherwise the local fake provider is used. */
export function usesRealOAuth(config: Config): boolean {
  return Boolean(config.GITHUB_CLIENT_ID && config.GITHUB_CLIENT_SECRET);
}

/** Reads and validates the process environment (or a given object, for tests). */
export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const parsed = envSchema.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new ConfigError(`Invalid configuration:\n${lines.join('\n')}`);
  }
  const c = parsed.data;
  if (Boolean(c.GITHUB_CLIENT_ID) !== Boolean(c.GITHUB_CLIENT_SECRET)) {
    throw new ConfigError('Set both GITHUB_CLIENT_ID and GITHUB_CLIENT_SECRET (or neither, to use the local fake sign-in).');
  }
  if (c.NODE_ENV === 'production') {
    if (c.SESSION_SECRET.startsWith('tapline-development')) {
      throw new ConfigError('SESSION_SECRET must be set to a long random string in production.');
    }
    if (!usesRealOAuth(c) && !c.TAPLINE_ALLOW_FAKE_OAUTH) {
      throw new ConfigError('Production needs GITHUB_CLIENT_ID and GITHUB_CLIENT_SECRET: the local fake sign-in lets anyone in as anyone (README, "Signing in with GitHub").');
    }
    if (!c.PUBLIC_URL) throw new ConfigError('PUBLIC_URL must be set in production (it goes into e-mailed links).');
  }
  return c;
}
