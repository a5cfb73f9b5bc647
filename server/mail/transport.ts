import "server-only";
import nodemailer, { type Transporter } from "nodemailer";

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

const flag = (value: string | undefined, fallback: boolean) =>
  value === undefined || value === "" ? fallback : value === "true" || value === "1";

export function smtpConfig(env: NodeJS.ProcessEnv = process.env): SmtpConfig {
  const secure = flag(env.KEELSON_SMTP_SECURE, false);
  return {
    host: env.KEELSON_SMTP_HOST || "127.0.0.1",
    port: Number(env.KEELSON_SMTP_PORT || (secure ? 465 : 587)),
    secure,
    // The fake offers no STARTTLS; a real relay should leave this off so the session is encrypted.
    ignoreTLS: flag(env.KEELSON_SMTP_IGNORE_TLS, false),
    user: env.KEELSON_SMTP_USER || undefined,
    password: env.KEELSON_SMTP_PASSWORD || undefined,
    from: env.KEELSON_MAIL_FROM || "Keelson <keelson@brightwater.example>",
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
