import { MAIL_FROM, SMTP_HOST, SMTP_PASSWORD, SMTP_PORT, SMTP_USER } from 'astro:env/server';
import { createMailer } from './mailer';

/** The app's one SMTP sender. */
export const mailer = createMailer({ host: SMTP_HOST, port: SMTP_PORT, from: MAIL_FROM, user: SMTP_USER, password: SMTP_PASSWORD });
