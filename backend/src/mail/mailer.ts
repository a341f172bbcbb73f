import nodemailer from 'nodemailer';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
}

export interface Mailer {
  send(mail: OutgoingMail): Promise<void>;
}

/** nodemailer to a real SMTP URL, or to the local sink on loopback. */
export function createMailer(options: { smtpUrl?: string; sinkPort?: number; from: string }): Mailer {
  const transport = options.smtpUrl
    ? nodemailer.createTransport(options.smtpUrl)
    : nodemailer.createTransport({ host: '127.0.0.1', port: options.sinkPort, secure: false, ignoreTLS: true });
  return {
    async send(mail) {
      await transport.sendMail({ from: options.from, ...mail });
    },
  };
}
