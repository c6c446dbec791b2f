import { isLanguage, languages, sourceLanguage, type Language } from '@shared/i18n/languages';
import { isIP } from 'node:net';
import { z } from 'zod';
import { defaultUsageStepLimits } from '@shared/domain/usage';

const proxyNames = ['loopback', 'linklocal', 'uniquelocal'];
const isProxyAddress = (entry: string) => {
  const [address = '', prefix, ...rest] = entry.split('/');
  if (rest.length > 0 || !isIP(address)) return false;
  if (prefix === undefined) return true;
  const max = isIP(address) === 4 ? 32 : 128;
  return /^\d{1,3}$/.test(prefix) && Number(prefix) <= max;
};

/**
 * Which hops may say who the client is (X-Forwarded-For). "none" (the default): nobody, the socket's address is the
 * client. A number: that many proxies in front. Otherwise a comma list of addresses, CIDR ranges or Express's
 * names loopback, linklocal and uniquelocal.
 */
const trustProxySchema = z
  .string()
  .trim()
  .default('none')
  .transform((value, ctx): false | number | string[] => {
    if (value === 'none' || value === '') return false;
    if (/^\d+$/.test(value)) {
      const hops = Number(value);
      if (hops >= 1 && hops <= 10) return hops;
      ctx.addIssue({ code: 'custom', message: 'TRUST_PROXY as a number of proxies is 1 to 10.' });
      return z.NEVER;
    }
    const entries = value.split(',').map((e) => e.trim());
    const wrong = entries.filter((e) => !proxyNames.includes(e) && !isProxyAddress(e));
    if (wrong.length > 0) {
      ctx.addIssue({
        code: 'custom',
        message:
          `TRUST_PROXY is "none", a number of proxies, or a comma list of addresses, CIDR ranges, loopback, ` +
          `linklocal or uniquelocal; not ${wrong.map((w) => JSON.stringify(w)).join(', ')}.`,
      });
      return z.NEVER;
    }
    return entries;
  });

/**
 * Where photos are kept: any S3-compatible object store, reached through the AWS SDK. Unset endpoint: no store is
 * configured and a photo upload is refused with a plain message (`npm start` and the tests run a local fake).
 */
const photoStoreShape = {
  /** Empty counts as unset, as in an env file that names the setting without a value. */
  PHOTO_STORE_ENDPOINT: z.preprocess(
    (v) => (v === '' ? undefined : v),
    z
      .url({
        message: 'PHOTO_STORE_ENDPOINT is the address of an S3-compatible store, such as https://s3.example.',
      })
      .optional(),
  ),
  PHOTO_STORE_BUCKET: z
    .string()
    .regex(
      /^[a-z0-9][a-z0-9.-]{1,61}[a-z0-9]$/,
      'PHOTO_STORE_BUCKET is an S3 bucket name: 3 to 63 of a-z, 0-9, dot and dash.',
    )
    .default('gaugewalk-photos'),
  PHOTO_STORE_REGION: z.string().min(1).default('us-east-1'),
  /** Unset both: the SDK's own chain (environment, shared files, instance role) finds the keys. */
  PHOTO_STORE_ACCESS_KEY_ID: z.string().min(1).optional(),
  PHOTO_STORE_SECRET_ACCESS_KEY: z.string().min(1).optional(),
  /** Bucket in the path (most S3-compatible stores) rather than in the host name (AWS). Default: true with an endpoint. */
  PHOTO_STORE_PATH_STYLE: z
    .enum(['true', 'false'])
    .optional()
    .transform((v) => (v === undefined ? undefined : v === 'true')),
};

const keysTogether = (s: { PHOTO_STORE_ACCESS_KEY_ID?: string; PHOTO_STORE_SECRET_ACCESS_KEY?: string }) =>
  !s.PHOTO_STORE_ACCESS_KEY_ID === !s.PHOTO_STORE_SECRET_ACCESS_KEY;
const keysTogetherMessage = {
  message: 'Set PHOTO_STORE_ACCESS_KEY_ID and PHOTO_STORE_SECRET_ACCESS_KEY together, or neither.',
  path: ['PHOTO_STORE_SECRET_ACCESS_KEY'],
};

const photoStoreSchema = z.object(photoStoreShape).refine(keysTogether, keysTogetherMessage);

export type PhotoStoreConfig = z.infer<typeof photoStoreSchema>;

const envSchema = z
  .object({
    NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
    PORT: z.coerce.number().int().min(0).max(65535).default(8080),
    HOST: z.string().default('0.0.0.0'),
    DATABASE_URL: z.string().regex(/^mariadb:\/\//, 'DATABASE_URL must start with mariadb://'),
    SESSION_SECRET: z.string().min(16, 'SESSION_SECRET must be at least 16 characters'),
    KIOSK_IDLE_SECONDS: z.coerce.number().int().min(1).max(3600).default(90),
    DESK_IDLE_MINUTES: z.coerce
      .number()
      .int()
      .min(1)
      .max(24 * 60)
      .default(8 * 60),
    PIN_MAX_ATTEMPTS: z.coerce.number().int().min(1).max(20).default(5),
    PIN_LOCK_MINUTES: z.coerce
      .number()
      .int()
      .min(1)
      .max(24 * 60)
      .default(15),
    /** Failures of one badge from this many addresses in the window lock it even when none came from a tablet. */
    LOCK_MIN_ADDRESSES: z.coerce.number().int().min(2).max(1000).default(10),
    TRUST_PROXY: trustProxySchema,
    SIGN_IN_RATE_PER_MINUTE: z.coerce.number().int().min(1).default(30),
    /** Instances with the same scope count sign-in attempts and failures together, in the database. */
    SIGN_IN_COUNT_SCOPE: z
      .string()
      .regex(/^[A-Za-z0-9_-]{1,40}$/, 'SIGN_IN_COUNT_SCOPE is 1 to 40 letters, digits, - or _.')
      .default('gaugewalk'),
    /** Galera: `wsrep_sync_wait` on every connection (1: reads wait for writes certified before them; 0: off). */
    DB_SYNC_WAIT: z.coerce.number().int().min(0).max(15).default(1),
    BCRYPT_COST: z.coerce.number().int().min(4).max(15).default(10),
    DATA_DIR: z.string().default('.data'),
    SECURE_COOKIES: z
      .enum(['true', 'false'])
      .default('false')
      .transform((v) => v === 'true'),
    TLS_CERT_FILE: z.string().optional(),
    TLS_KEY_FILE: z.string().optional(),
    LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'silent']).default('info'),
    /** Unset: no mail server, every e-mail is recorded as not sent (tests never reach a running demo's fake). */
    SMTP_HOST: z.string().min(1).optional(),
    SMTP_PORT: z.coerce.number().int().min(1).max(65535).default(2525),
    MAIL_FROM: z.string().min(3).default('Gaugewalk <gaugewalk@tern-island.example>'),
    /**
     * The most one entry of flight hours, flights and landings (after-flight check or flight close) may add: more is
     * taken for a slip of the finger and refused. A longer gap is entered at the desk.
     */
    USAGE_MAX_HOURS_PER_ENTRY: z.coerce.number().positive().max(1000).default(defaultUsageStepLimits.hours),
    USAGE_MAX_FLIGHTS_PER_ENTRY: z.coerce
      .number()
      .int()
      .min(1)
      .max(10_000)
      .default(defaultUsageStepLimits.flights),
    /** The operator named at the top of every printed record. */
    OPERATOR_NAME: z
      .string()
      .trim()
      .min(2)
      .max(120)
      .default('Tern Island Air Ambulance (invented demo operator)'),
    /**
     * The language e-mails to maintenance control are written in (a shipped language code: en, de). A recipient's
     * own preferred language, once people carry one, takes its place: server/mail/mail-language.ts.
     */
    OPERATOR_LANGUAGE: z
      .string()
      .trim()
      .default(sourceLanguage)
      .refine((code) => isLanguage(code), {
        message: `OPERATOR_LANGUAGE is one of the shipped languages: ${languages.join(', ')}.`,
      })
      .transform((code) => code as Language),
    /** The desk's address for QR codes on printed records; unset: the address the request came to. */
    PUBLIC_BASE_URL: z
      .url({ message: 'PUBLIC_BASE_URL is an address such as https://gaugewalk.example.' })
      .transform((u) => u.replace(/\/+$/, ''))
      .optional(),
    MAINTENANCE_CONTROL_EMAILS: z
      .string()
      .default('control@tern-island.example')
      .transform((list) =>
        list
          .split(',')
          .map((address) => address.trim())
          .filter(Boolean),
      )
      .pipe(z.array(z.email('MAINTENANCE_CONTROL_EMAILS is a comma list of e-mail addresses.')).min(1)),
    ...photoStoreShape,
  })
  .refine(keysTogether, keysTogetherMessage);

export type Config = z.infer<typeof envSchema>;

/** The usage step limits the checks and the pilots' flight closes are held to. */
export const usageLimitsOf = (config: Config) => ({
  hours: config.USAGE_MAX_HOURS_PER_ENTRY,
  flights: config.USAGE_MAX_FLIGHTS_PER_ENTRY,
  landings: config.USAGE_MAX_FLIGHTS_PER_ENTRY,
});

function parsed<T>(schema: z.ZodType<T>, env: NodeJS.ProcessEnv): T {
  const result = schema.safeParse(env);
  if (!result.success) {
    const lines = result.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`).join('\n');
    throw new Error(`Configuration is not valid:\n${lines}`);
  }
  return result.data;
}

export const loadConfig = (env: NodeJS.ProcessEnv = process.env): Config => parsed(envSchema, env);

/** The photo store's settings alone, for the commands that need no database or session (backup, photo migration). */
export const loadPhotoStoreConfig = (env: NodeJS.ProcessEnv = process.env): PhotoStoreConfig =>
  parsed(photoStoreSchema, env);
