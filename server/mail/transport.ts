import "server-only";
import nodemailer, { type Transporter } from "nodemailer";
import { env, type Env } from "@/server/env";

// SMTP from configuration only, so the local fake and a real relay are the same code path.
export type SmtpConfig = {
  host: string;
  port: number;
  secure: boolean;
  ignoreTLS: boolean;
  user?: string;
  password?: string;
  from: string;
};

export function smtpConfig(config: Env = env()): SmtpConfig {
  const secure = config.KEELSON_SMTP_SECURE;
  return {
    host: config.KEELSON_SMTP_HOST,
    port: config.KEELSON_SMTP_PORT ?? (secure ? 465 : 587),
    secure,
    // The fake offers no STARTTLS; a real relay should leave this off so the session is encrypted.
    ignoreTLS: config.KEELSON_SMTP_IGNORE_TLS,
    user: config.KEELSON_SMTP_USER,
    password: config.KEELSON_SMTP_PASSWORD,
    from: config.KEELSON_MAIL_FROM,
  };
}

const globalForMail = globalThis as unknown as { keelsonTransport?: Transporter };

/** One pooled SMTP transport per process. */
export function mailTransport(): Transporter {
  if (!globalForMail.keelsonTransport) {
    const config = smtpConfig();
    globalForMail.keelsonTransport = nodemailer.createTransport({
      pool: true,
      maxConnections: 2,
      host: config.host,
      port: config.port,
      secure: config.secure,
      ignoreTLS: config.ignoreTLS,
      ...(config.user ? { auth: { user: config.user, pass: config.password ?? "" } } : {}),
      connectionTimeout: 15_000,
      greetingTimeout: 15_000,
      socketTimeout: 60_000,
    });
  }
  return globalForMail.keelsonTransport;
}

export function closeMailTransport(): void {
  globalForMail.keelsonTransport?.close();
  globalForMail.keelsonTransport = undefined;
}
