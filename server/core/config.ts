import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { isIP } from 'node:net';
import path from 'node:path';
import { z } from 'zod';

/** Keys of the local fake payment service, used when no real keys are configured. */
export const FAKE_PAYMENTS_SECRET_KEY = 'sk_test_keepstitch_local_fake';
export const FAKE_PAYMENTS_WEBHOOK_SECRET = 'whsec_keepstitch_local_fake';

/** The project's own data folder (git-ignored): database cluster, secrets, uploads. */
export const DATA_DIR = path.resolve(__dirname, '..', '..', '.data');

const TRUST_PROXY_HELP =
  'TRUST_PROXY must be false, true, the number of proxies in front of the app (such as 1), or their addresses separated by commas (such as loopback or 10.0.0.5, 10.0.0.0/8)';

/** A proxy address Express's 'trust proxy' takes: a name of a range, an address, or address/prefix. */
function isProxyAddress(entry: string): boolean {
  if (['loopback', 'linklocal', 'uniquelocal'].includes(entry)) return true;
  const [address = '', prefix, extra] = entry.split('/');
  const version = isIP(address);
  if (!version || extra !== undefined) return false;
  return prefix === undefined || (/^\d{1,3}$/.test(prefix) && Number(prefix) <= (version === 4 ? 32 : 128));
}

/**
 * Which proxies in front of the app are trusted to say the client's address in
 * X-Forwarded-For (Express's 'trust proxy'): false (none, the default: the
 * address is the connection's), true (any: only when nothing but the proxy can
 * reach the app), a number of hops, or a list of the proxies' addresses.
 */
const trustProxySchema = z.string().transform((raw, ctx): boolean | number | string[] => {
  const value = raw.trim().toLowerCase();
  if (value === 'false' || value === '') return false;
  if (value === 'true') return true;
  if (/^\d+$/.test(value)) return Number(value);
  const entries = value.split(',').map((e) => e.trim());
  if (entries.every(isProxyAddress)) return entries;
  ctx.addIssue({ code: 'custom', message: TRUST_PROXY_HELP });
  return z.NEVER;
});

const configSchema = z.object({
  nodeEnv: z.enum(['development', 'production', 'test']),
  port: z.coerce.number().int().min(0).max(65535),
  host: z.string().min(1),
  databaseUrl: z.string().url({ message: 'DATABASE_URL must be a postgres:// URL' }).startsWith('postgres', {
    message: 'DATABASE_URL must be a postgres:// URL',
  }),
  sessionSecret: z.string().min(32, { message: 'SESSION_SECRET must be at least 32 characters' }),
  /** Serve cookies with the Secure flag (set when the app is reached over TLS). */
  secureCookies: z.boolean(),
  /** Failed sign-in attempts at one account (from anywhere) in one window; then it is refused until the window ends. */
  signInLimit: z.coerce.number().int().positive({ message: 'SIGN_IN_LIMIT must be a whole number of attempts, 1 or more' }),
  /** Failed sign-in attempts from one address in one window before each further one waits signInDelayMs (server/auth/sign-in-limits.ts). */
  signInAddressLimit: z.coerce.number().int().positive({ message: 'SIGN_IN_ADDRESS_LIMIT must be a whole number of attempts, 1 or more' }),
  signInWindowMs: z.coerce.number().int().positive({ message: 'SIGN_IN_WINDOW_MS must be a positive number of milliseconds' }),
  /** How long an attempt from an address past its limit waits before its password is checked. */
  signInDelayMs: z.coerce.number().int().min(0, { message: 'SIGN_IN_DELAY_MS must be 0 or more milliseconds' }),
  trustProxy: trustProxySchema,
  /** A session ends after this many minutes without a request. */
  sessionIdleMinutes: z.coerce.number().positive({ message: 'SESSION_IDLE_MINUTES must be a positive number of minutes' }),
  /** An unchanged session's expiry is written to the database at most this often. */
  sessionTouchSeconds: z.coerce.number().min(0, { message: 'SESSION_TOUCH_SECONDS must be 0 or more' }),
  /** Folder of the built Angular app; the server serves it when present. */
  webRoot: z.string().min(1),
  /** Folder of uploaded photos: outside the web root, never served directly. */
  uploadDir: z.string().min(1),
  /** Address the app is reached at, for links in e-mails and payment returns. */
  appUrl: z.string().url({ message: 'APP_URL must be a URL such as http://127.0.0.1:4300' }),
  smtp: z.object({
    host: z.string().min(1),
    port: z.coerce.number().int().min(1).max(65535),
    secure: z.boolean(),
    user: z.string().optional(),
    password: z.string().optional(),
  }),
  mailFrom: z.string().min(3),
  /** The local fake mail server's message list (development): enables the owner's sent-mail page. */
  fakeMailApi: z.string().url().optional(),
  payments: z.object({
    secretKey: z.string().min(8),
    webhookSecret: z.string().min(8),
    /** Where the payment SDK sends its calls: the local fake unless real keys are configured. */
    apiUrl: z.string().url().optional(),
  }),
});

export type AppConfig = z.infer<typeof configSchema>;

/** Reads the dev session secret from the data folder, creating it the first time. */
function devSessionSecret(): string {
  const file = path.join(DATA_DIR, 'session-secret');
  if (existsSync(file)) return readFileSync(file, 'utf8').trim();
  mkdirSync(DATA_DIR, { recursive: true });
  const secret = randomBytes(48).toString('base64url');
  writeFileSync(file, secret + '\n', { mode: 0o600 });
  return secret;
}

/**
 * Reads configuration from the environment once and validates it.
 * A missing or bad value throws with a message naming the setting.
 */
export function loadConfig(env: NodeJS.ProcessEnv = process.env): AppConfig {
  const nodeEnv = env['NODE_ENV'] ?? 'development';
  const raw = {
    nodeEnv,
    port: env['PORT'] ?? '4300',
    host: env['HOST'] ?? '127.0.0.1',
    databaseUrl: env['DATABASE_URL'],
    sessionSecret: env['SESSION_SECRET'] ?? (nodeEnv === 'production' ? undefined : devSessionSecret()),
    secureCookies: env['SECURE_COOKIES'] === 'true',
    signInLimit: env['SIGN_IN_LIMIT'] ?? '10',
    signInAddressLimit: env['SIGN_IN_ADDRESS_LIMIT'] ?? '10',
    signInWindowMs: env['SIGN_IN_WINDOW_MS'] ?? String(15 * 60 * 1000),
    signInDelayMs: env['SIGN_IN_DELAY_MS'] ?? '2000',
    trustProxy: env['TRUST_PROXY'] ?? 'false',
    sessionIdleMinutes: env['SESSION_IDLE_MINUTES'] ?? '720',
    sessionTouchSeconds: env['SESSION_TOUCH_SECONDS'] ?? '60',
    webRoot: env['WEB_ROOT'] ?? path.resolve(__dirname, '..', '..', 'dist', 'keepstitch', 'browser'),
    uploadDir: env['UPLOAD_DIR'] ?? path.join(DATA_DIR, 'uploads'),
    appUrl: env['APP_URL'] ?? `http://${env['HOST'] ?? '127.0.0.1'}:${env['PORT'] ?? '4300'}`,
    smtp: {
      host: env['SMTP_HOST'] ?? '127.0.0.1',
      port: env['SMTP_PORT'] ?? '2525',
      secure: env['SMTP_SECURE'] === 'true',
      user: env['SMTP_USER'] || undefined,
      password: env['SMTP_PASSWORD'] || undefined,
    },
    mailFrom: env['MAIL_FROM'] ?? 'Keepstitch <studio@keepstitch.test>',
    fakeMailApi: env['FAKE_MAIL_API'] || undefined,
    payments: env['PAYMENTS_SECRET_KEY']
      ? { secretKey: env['PAYMENTS_SECRET_KEY'], webhookSecret: env['PAYMENTS_WEBHOOK_SECRET'], apiUrl: env['PAYMENTS_API_URL'] || undefined }
      : {
          secretKey: FAKE_PAYMENTS_SECRET_KEY,
          webhookSecret: env['PAYMENTS_WEBHOOK_SECRET'] ?? FAKE_PAYMENTS_WEBHOOK_SECRET,
          apiUrl: env['PAYMENTS_API_URL'] ?? 'http://127.0.0.1:12111',
        },
  };
  const parsed = configSchema.safeParse(raw);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.') || 'config'}: ${i.message}`);
    throw new Error(`Keepstitch cannot start: the configuration is not valid.\n${lines.join('\n')}`);
  }
  return parsed.data;
}
