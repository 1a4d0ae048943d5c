import { z } from 'zod';

const port = z.coerce.number().int().min(0).max(65535);

const schema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  HOST: z.string().default('127.0.0.1'),
  PORT: port.default(3000),
  APP_URL: z.url().default('http://127.0.0.1:3000'),
  DATABASE_URL: z.string().regex(/^postgres(ql)?:\/\//, 'must be a postgres:// URL').default('postgres://app@127.0.0.1:54329/tamp'),
  SESSION_SECRET: z.string().min(16, 'must be at least 16 characters').default('dev-only-session-secret-change-me'),
  SMTP_HOST: z.string().default('127.0.0.1'),
  SMTP_PORT: port.default(1025),
  MAIL_FROM: z.string().default('Tamp & Tally <no-reply@tamp-and-tally.test>'),
  DEV_MAILBOX_URL: z.union([z.url(), z.literal('')]).default('http://127.0.0.1:8025'),
  STRIPE_SECRET_KEY: z.string().regex(/^sk_(test|live)_/, 'must start with sk_test_ or sk_live_').default('sk_test_tamp_and_tally_local'),
  STRIPE_API_HOST: z.string().default('127.0.0.1'),
  STRIPE_API_PORT: port.default(12111),
  STRIPE_API_PROTOCOL: z.enum(['http', 'https']).default('http'),
  STRIPE_WEBHOOK_SECRET: z.string().regex(/^whsec_/, 'must start with whsec_').default('whsec_tamp_and_tally_local_secret'),
  UPLOAD_DIR: z.string().default('.data/uploads'),
  UPLOAD_MAX_BYTES: z.coerce.number().int().positive().default(10 * 1024 * 1024),
  CHECK_RESPONSES: z.enum(['0', '1', 'true', 'false', '']).default('').transform((v) => v === '1' || v === 'true'),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  LOGIN_MAX_FAILURES: z.coerce.number().int().positive().default(5),
  LOGIN_MAX_FAILURES_PER_ADDRESS: z.coerce.number().int().positive().default(20),
  LOGIN_WINDOW_MINUTES: z.coerce.number().int().positive().default(15),
});

export type Config = z.infer<typeof schema> & {
  cookieSecure: boolean;
  paymentsTestMode: boolean;
  /** Check every JSON response against its contract entry (tests, and development on request). */
  checkResponses: boolean;
};

export class ConfigError extends Error {}

/** Parses the environment; a bad value throws naming the variable. */
export function loadConfig(env: Record<string, string | undefined> = process.env): Config {
  const parsed = schema.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new ConfigError(`Invalid configuration:\n${lines.join('\n')}`);
  }
  const c = parsed.data;
  if (c.NODE_ENV === 'production') {
    const problems = productionProblems(c);
    if (problems.length > 0) throw new ConfigError(`Invalid configuration for production:\n${problems.map((p) => `  ${p}`).join('\n')}`);
  }
  return {
    ...c,
    cookieSecure: c.APP_URL.startsWith('https:'),
    paymentsTestMode: c.STRIPE_SECRET_KEY.startsWith('sk_test_'),
    checkResponses: c.NODE_ENV === 'test' || c.CHECK_RESPONSES,
  };
}

const LOOPBACK = /^(127\.\d+\.\d+\.\d+|localhost|::1|\[::1\]|0\.0\.0\.0)$/i;

/**
 * What production must not run with: the development defaults of the secrets (anyone who has
 * read this repository knows them, and could sign a payment event or a session cookie), and a
 * payments API that is the bundled local fake rather than the provider.
 */
function productionProblems(c: z.infer<typeof schema>): string[] {
  const out: string[] = [];
  const isDefault = (name: 'SESSION_SECRET' | 'STRIPE_WEBHOOK_SECRET' | 'STRIPE_SECRET_KEY') => c[name] === schema.shape[name].parse(undefined);
  if (isDefault('SESSION_SECRET')) out.push('SESSION_SECRET: still the development default; set a long random secret');
  if (isDefault('STRIPE_WEBHOOK_SECRET')) out.push("STRIPE_WEBHOOK_SECRET: still the development default; set the provider's signing secret");
  if (isDefault('STRIPE_SECRET_KEY')) out.push("STRIPE_SECRET_KEY: still the development default; set the provider's secret key");
  if (LOOPBACK.test(c.STRIPE_API_HOST)) out.push(`STRIPE_API_HOST: ${c.STRIPE_API_HOST} is the local payments fake; point it at the payments provider`);
  if (c.STRIPE_API_PROTOCOL !== 'https') out.push('STRIPE_API_PROTOCOL: payments must go over https in production');
  return out;
}

/** The explicit list of configuration that reaches the browser. */
export function publicConfig(c: Config) {
  return { paymentsTestMode: c.paymentsTestMode, devMailboxUrl: c.NODE_ENV === 'production' ? null : c.DEV_MAILBOX_URL || null };
}
