import nodemailer from 'nodemailer';
import type { DataSource, EntityManager } from 'typeorm';
import { enqueueMail } from './outbox.js';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
}

export interface Mailer {
  send(mail: OutgoingMail): Promise<void>;
}

/** Seconds an SMTP server may take at each step before a delivery attempt is given up and retried later. */
const SMTP_TIMEOUT_MS = 15_000;

/**
 * Hands mail to SMTP right away: a real server (SMTP_URL) or the local sink on loopback. Only the outbox
 * delivery loop uses this; requests use the outbox mailer, so no answer waits for an SMTP server.
 */
export function createMailer(options: { smtpUrl?: string; sinkPort?: number; from: string; timeoutMs?: number }): Mailer {
  const timeouts = {
    connectionTimeout: options.timeoutMs ?? SMTP_TIMEOUT_MS,
    greetingTimeout: options.timeoutMs ?? SMTP_TIMEOUT_MS,
    socketTimeout: options.timeoutMs ?? SMTP_TIMEOUT_MS,
  };
  const transport = options.smtpUrl
    ? nodemailer.createTransport({ url: options.smtpUrl, ...timeouts })
    : nodemailer.createTransport({ host: '127.0.0.1', port: options.sinkPort, secure: false, ignoreTLS: true, ...timeouts });
  return {
    async send(mail) {
      await transport.sendMail({ from: options.from, ...mail });
    },
  };
}

/** What routes and services use: `send` only adds the mail to the outbox; it goes out after the answer. */
export function createOutboxMailer(ds: DataSource | EntityManager): Mailer {
  return {
    async send(mail) {
      await enqueueMail(ds, mail);
    },
  };
}
