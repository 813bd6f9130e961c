// Outgoing e-mail through nodemailer to SMTP_URL. Without SMTP_URL nothing is sent and the
// caller is told so (the outcome is returned, never thrown).
import nodemailer from 'nodemailer';
import type { Logger } from 'pino';

export interface MailMessage {
  to: string;
  subject: string;
  text: string;
}

export interface MailOutcome {
  delivered: boolean;
  error?: string;
}

export interface Mailer {
  send(message: MailMessage): Promise<MailOutcome>;
  close(): void;
}

export function createMailer(options: { smtpUrl?: string; from: string; logger: Logger }): Mailer {
  if (!options.smtpUrl) {
    return {
      async send(message) {
        options.logger.warn({ to: message.to, subject: message.subject }, 'e-mail not sent: SMTP_URL is not set');
        return { delivered: false, error: 'Mail delivery is not configured (SMTP_URL).' };
      },
      close() {},
    };
  }
  const transport = nodemailer.createTransport(options.smtpUrl);
  return {
    async send(message) {
      try {
        await transport.sendMail({ from: options.from, ...message });
        return { delivered: true };
      } catch (error) {
        options.logger.error({ err: error, to: message.to }, 'e-mail delivery failed');
        return { delivered: false, error: 'The SMTP server did not accept the message.' };
      }
    },
    close() {
      transport.close();
    },
  };
}
