import nodemailer from 'nodemailer';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html?: string;
}

export interface Mailer {
  send(mail: OutgoingMail): Promise<void>;
}

export const MAIL_FROM = 'Treadle <no-reply@treadle.local>';

/** Mail over SMTP (nodemailer): the local mail catcher in development and tests, a real relay elsewhere. */
export function smtpMailer(options: { host: string; port: number; secure?: boolean; auth?: { user: string; pass: string } }): Mailer & { close(): void } {
  const transport = nodemailer.createTransport({
    host: options.host,
    port: options.port,
    secure: options.secure ?? false,
    auth: options.auth,
    // The local catcher speaks plain SMTP on loopback; a real relay is configured with secure/auth.
    ignoreTLS: !options.secure && !options.auth,
  });
  return {
    async send(mail) {
      await transport.sendMail({ from: MAIL_FROM, ...mail });
    },
    close: () => transport.close(),
  };
}
