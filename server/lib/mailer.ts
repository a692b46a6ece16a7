// Outgoing e-mail through nodemailer's SMTP transport. `npm start` and the tests point SMTP_URL at
// the local catcher; without SMTP_URL messages are written to the server log instead of sent.
import nodemailer, { type Transporter } from 'nodemailer';
import { logger } from './logger';

/** `messageId`: a stable Message-ID header (the outbox gives each notice its own). */
export type Mail = { to: string[]; subject: string; text: string; messageId?: string };
export type Mailer = { send(mail: Mail): Promise<void> };

export function createMailer(smtpUrl: string | undefined, from = 'Hotwell <hotwell@fernhollow.example>'): Mailer {
  if (!smtpUrl) {
    return {
      async send(mail) {
        logger.info({ to: mail.to, subject: mail.subject }, 'mail not sent (no SMTP_URL)');
      },
    };
  }
  const transport: Transporter = nodemailer.createTransport(smtpUrl);
  return {
    async send(mail) {
      if (!mail.to.length) return;
      await transport.sendMail({ from, to: mail.to, subject: mail.subject, text: mail.text, messageId: mail.messageId });
    },
  };
}
