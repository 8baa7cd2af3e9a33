import 'server-only';
import { z } from 'zod';
import { defaultDatabaseUrl } from '@/knexfile';

const DEV_SECRET = 'needlemap-development-secret-change-me-0123456789';

const schema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  DATABASE_URL: z.string().url().default(defaultDatabaseUrl),
  SESSION_SECRET: z.string().min(32, 'SESSION_SECRET must be at least 32 characters').optional(),
  /** "true" when the app is served over https (cookies marked Secure). */
  COOKIE_SECURE: z.enum(['true', 'false']).optional(),
  APP_URL: z.string().url().default('http://127.0.0.1:3000'),
  /** "true" behind a reverse proxy: the first X-Forwarded-For hop is the caller's address. */
  TRUST_PROXY: z.enum(['true', 'false']).optional(),
  /** "true" in the demo and in tests: allows the development-only pages (mail outbox). */
  NEEDLEMAP_DEV_PAGES: z.enum(['true', 'false']).optional(),
});

export type Env = z.infer<typeof schema> & { SESSION_SECRET: string; cookieSecure: boolean; devPages: boolean; trustProxy: boolean };

let cached: Env | undefined;

/** The validated environment, read once. Production refuses to run on the development secret. */
export function env(): Env {
  if (cached) return cached;
  const parsed = schema.safeParse(process.env);
  if (!parsed.success) {
    throw new Error(`Invalid environment: ${parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`).join('; ')}`);
  }
  const e = parsed.data;
  if (e.NODE_ENV === 'production' && (!e.SESSION_SECRET || e.SESSION_SECRET === DEV_SECRET)) {
    throw new Error('SESSION_SECRET must be set to a secret of your own in production');
  }
  cached = {
    ...e,
    SESSION_SECRET: e.SESSION_SECRET ?? DEV_SECRET,
    cookieSecure: e.COOKIE_SECURE ? e.COOKIE_SECURE === 'true' : e.APP_URL.startsWith('https:'),
    trustProxy: e.TRUST_PROXY === 'true',
    devPages: e.NODE_ENV !== 'production' || e.NEEDLEMAP_DEV_PAGES === 'true',
  };
  return cached;
}
