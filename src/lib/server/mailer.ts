import nodemailer from 'nodemailer';

export interface MailSettings {
  host: string;
  port: number;
  from: string;
  user?: string;
  password?: string;
}

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
}

export interface Mailer {
  send(mail: OutgoingMail): Promise<void>;
}

/**
 * An SMTP sender built from plain settings, so the app (astro:env) and command-line jobs such as
 * `npm run remind` (process.env) share it. Plain-text mail: it reads the same on every client.
 */
export function createMailer(settings: MailSettings): Mailer {
  const transport = nodemailer.createTransport({
    host: settings.host,
    port: settings.port,
    secure: settings.port === 465,
    auth: settings.user ? { user: settings.user, pass: settings.password ?? '' } : undefined,
  });
  return {
    async send(mail) {
      await transport.sendMail({ from: settings.from, to: mail.to, subject: mail.subject, text: mail.text });
    },
  };
}

export function mailSettingsFromEnv(env: NodeJS.ProcessEnv): MailSettings {
  return {
    host: env.SMTP_HOST ?? '127.0.0.1',
    port: Number(env.SMTP_PORT ?? 2525),
    from: env.MAIL_FROM ?? 'Benchwright <no-reply@benchwright.example>',
    user: env.SMTP_USER || undefined,
    password: env.SMTP_PASSWORD || undefined,
  };
}
