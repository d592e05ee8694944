import nodemailer from 'nodemailer';
import type { Config } from '../config';
import type { Logger } from '../logger';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html?: string;
}

export interface Mailer {
  send(mail: OutgoingMail): Promise<void>;
  close(): Promise<void>;
}

/** nodemailer over SMTP (the local SMTP fake in development and tests). */
export function createMailer(config: Config, logger: Logger): Mailer {
  const transport = nodemailer.createTransport({ host: config.SMTP_HOST, port: config.SMTP_PORT, secure: false, ignoreTLS: true });
  return {
    async send(mail) {
      await transport.sendMail({ from: config.MAIL_FROM, ...mail });
      logger.info({ to: mail.to, subject: mail.subject }, 'mail sent');
    },
    async close() {
      transport.close();
    },
  };
}
