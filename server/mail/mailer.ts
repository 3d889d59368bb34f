import nodemailer from 'nodemailer';
import type { Logger } from 'pino';

/** One e-mail, in the shape every transport takes. */
export interface MailMessage {
  to: string;
  subject: string;
  text: string;
  html?: string;
}

/** What the services send mail through; tests and `npm start` pick the transport. */
export interface Mailer {
  send(message: MailMessage): Promise<void>;
}

/** Sends nothing: the default for tests that do not look at mail. */
export const noopMailer: Mailer = { send: async () => undefined };

export interface SmtpOptions {
  host: string;
  port: number;
  from: string;
  /** The local fake offers no TLS; a real provider on 587 upgrades with STARTTLS. */
  ignoreTLS?: boolean;
  logger?: Logger;
}

/** SMTP through nodemailer; a real provider is a change of SMTP_HOST / SMTP_PORT. */
export function smtpMailer(opts: SmtpOptions): Mailer {
  const transport = nodemailer.createTransport({
    host: opts.host,
    port: opts.port,
    secure: false,
    ignoreTLS: opts.ignoreTLS ?? false,
  });
  return {
    async send(m) {
      await transport.sendMail({ from: opts.from, to: m.to, subject: m.subject, text: m.text, html: m.html });
      opts.logger?.info({ to: m.to, subject: m.subject }, 'mail sent');
    },
  };
}
