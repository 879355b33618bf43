import nodemailer from 'nodemailer';
import type { Logger } from 'pino';
import type { Config } from '../config.js';

/** An address, or an address with the name mail programs show for it. */
export type MailAddress = string | { name: string; address: string };

export interface OutgoingMail {
  to: string;
  /** The name shown as the sender (the address stays the platform's own, `MAIL_FROM`). */
  fromName?: string;
  /** Where an answer goes: the firm for a visitor's copy, the visitor for the firm's notification. */
  replyTo?: MailAddress | MailAddress[];
  subject: string;
  text: string;
  html: string;
  attachments?: { filename: string; content: Buffer; contentType: string }[];
}

export interface Mailer {
  /** Hand the message to SMTP; rejects when it could not. */
  send(mail: OutgoingMail): Promise<void>;
  close(): void;
}

/** Nodemailer over SMTP, with short timeouts so a dead relay fails a request in seconds, not minutes. */
export function createSmtpMailer(mail: Config['mail']): Mailer {
  const transport = nodemailer.createTransport({
    host: mail.smtpHost,
    port: mail.smtpPort,
    secure: mail.smtpSecure,
    ...(mail.smtpUser ? { auth: { user: mail.smtpUser, pass: mail.smtpPassword ?? '' } } : {}),
    connectionTimeout: 5_000,
    greetingTimeout: 5_000,
    socketTimeout: 10_000,
  });
  // The sending address alone ("Wickstone <mail@…>" → "mail@…"): a firm's name goes in front of it.
  const fromAddress = /<([^>]+)>\s*$/.exec(mail.from)?.[1] ?? mail.from;
  return {
    async send(m) {
      await transport.sendMail({
        from: m.fromName ? { name: m.fromName, address: fromAddress } : mail.from,
        ...(m.replyTo ? { replyTo: m.replyTo } : {}),
        to: m.to,
        subject: m.subject,
        text: m.text,
        html: m.html,
        attachments: m.attachments,
      });
    },
    close() {
      transport.close();
    },
  };
}

/**
 * Send, and on failure log and report false instead of throwing: the invitation or reset row it
 * belongs to is already committed and can be sent again.
 */
export async function sendSafely(
  mailer: Mailer,
  logger: Logger,
  mail: OutgoingMail,
  what: string,
): Promise<boolean> {
  try {
    await mailer.send(mail);
    return true;
  } catch (err) {
    logger.error({ err, what, to: mail.to }, 'e-mail could not be sent');
    return false;
  }
}
