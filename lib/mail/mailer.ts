/**
 * Outgoing e-mail through nodemailer over SMTP. The host comes from the environment: in
 * development and tests the local SMTP fake (no TLS, no authentication), in production the
 * studio's mail relay.
 */
import nodemailer, { type Transporter } from 'nodemailer';
import { z } from 'zod';

const schema = z.object({
  SMTP_HOST: z.string().min(1).optional(),
  SMTP_PORT: z.coerce.number().int().min(1).max(65535).default(587),
  /** "true" for SMTP over TLS from the first byte (port 465). */
  SMTP_SECURE: z.enum(['true', 'false']).optional(),
  /** "true" only for the local fake: never upgrade to TLS. */
  SMTP_IGNORE_TLS: z.enum(['true', 'false']).optional(),
  SMTP_USER: z.string().min(1).optional(),
  SMTP_PASSWORD: z.string().min(1).optional(),
  MAIL_FROM: z.string().min(3).default('Needlemap <no-reply@needlemap.invalid>'),
});

export type MailConfig = z.infer<typeof schema>;

export function mailConfig(env: NodeJS.ProcessEnv = process.env): MailConfig {
  const parsed = schema.safeParse(env);
  if (!parsed.success) throw new Error(`Invalid mail settings: ${parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`).join('; ')}`);
  return parsed.data;
}

export interface OutgoingMail {
  to: string[];
  subject: string;
  text: string;
  html?: string;
}

export interface MailResult {
  sent: string[];
  failed: { to: string; error: string }[];
  /** Set when no SMTP host is configured: nothing was sent. */
  skipped?: string;
}

const globalMail = globalThis as unknown as { needlemapMailer?: { key: string; transport: Transporter } };

function transport(cfg: MailConfig): Transporter {
  const key = JSON.stringify([cfg.SMTP_HOST, cfg.SMTP_PORT, cfg.SMTP_SECURE, cfg.SMTP_IGNORE_TLS, cfg.SMTP_USER]);
  if (globalMail.needlemapMailer?.key === key) return globalMail.needlemapMailer.transport;
  const t = nodemailer.createTransport({
    host: cfg.SMTP_HOST,
    port: cfg.SMTP_PORT,
    secure: cfg.SMTP_SECURE === 'true',
    ignoreTLS: cfg.SMTP_IGNORE_TLS === 'true',
    ...(cfg.SMTP_USER && cfg.SMTP_PASSWORD ? { auth: { user: cfg.SMTP_USER, pass: cfg.SMTP_PASSWORD } } : {}),
    connectionTimeout: 5000,
    greetingTimeout: 5000,
    socketTimeout: 10000,
  });
  globalMail.needlemapMailer = { key, transport: t };
  return t;
}

/**
 * Sends one message per recipient (so one bad address does not stop the others) and reports what
 * went and what did not; never throws for a delivery failure.
 */
export async function sendMail(mail: OutgoingMail, cfg: MailConfig = mailConfig()): Promise<MailResult> {
  const to = [...new Set(mail.to.map((a) => a.trim().toLowerCase()).filter(Boolean))];
  if (!cfg.SMTP_HOST) return { sent: [], failed: [], skipped: 'No SMTP host is configured (SMTP_HOST).' };
  const t = transport(cfg);
  const result: MailResult = { sent: [], failed: [] };
  for (const address of to) {
    try {
      await t.sendMail({ from: cfg.MAIL_FROM, to: address, subject: mail.subject, text: mail.text, ...(mail.html ? { html: mail.html } : {}) });
      result.sent.push(address);
    } catch (err) {
      result.failed.push({ to: address, error: err instanceof Error ? err.message : String(err) });
    }
  }
  return result;
}
