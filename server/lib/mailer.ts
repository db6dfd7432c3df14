/**
 * Outgoing mail over SMTP with nodemailer. The only module that knows
 * nodemailer exists. Without SMTP settings it talks to the local catcher.
 */
import nodemailer from 'nodemailer';
import type { MailConfig } from '@server/config';

export type OutgoingMail = { to: string; subject: string; text: string; html: string };

export type Mailer = {
  send(mail: OutgoingMail): Promise<{ messageId: string }>;
  close(): void;
};

// A mail server that is down or hangs must not hold the worker for minutes.
const timeouts = { connectionTimeout: 10_000, greetingTimeout: 10_000, socketTimeout: 30_000 };

export function createMailer(mail: Pick<MailConfig, 'from' | 'smtp' | 'catcherPort'>): Mailer {
  const smtp = mail.smtp;
  const transport = !smtp
    ? // The catcher listens on loopback only and offers no TLS.
      nodemailer.createTransport({
        host: '127.0.0.1',
        port: mail.catcherPort,
        secure: false,
        ignoreTLS: true,
        ...timeouts,
      })
    : 'url' in smtp
      ? nodemailer.createTransport(smtp.url, {})
      : nodemailer.createTransport({
          host: smtp.host,
          port: smtp.port,
          secure: smtp.secure,
          ...(smtp.user ? { auth: { user: smtp.user, pass: smtp.pass ?? '' } } : {}),
          ...timeouts,
        });
  return {
    async send(m) {
      const info = await transport.sendMail({
        from: mail.from,
        to: m.to,
        subject: m.subject,
        text: m.text,
        html: m.html,
      });
      return { messageId: String(info.messageId ?? '') };
    },
    close() {
      transport.close();
    },
  };
}
