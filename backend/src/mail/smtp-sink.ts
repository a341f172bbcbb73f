/**
 * Local SMTP sink for development and tests: accepts every message on loopback and keeps the last
 * few hundred in memory for the mailbox page. Off whenever SMTP_URL points at a real server.
 */
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';

export interface SunkMessage {
  id: number;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string | null;
}

export interface SmtpSink {
  port: number;
  messages: () => SunkMessage[];
  clear: () => void;
  close: () => Promise<void>;
}

const KEEP = 500;

export async function startSmtpSink(port: number): Promise<SmtpSink> {
  const stored: SunkMessage[] = [];
  let nextId = 1;
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((mail) => {
          stored.unshift({
            id: nextId++,
            receivedAt: new Date().toISOString(),
            from: mail.from?.text ?? '',
            to: (session.envelope.rcptTo ?? []).map((r) => r.address),
            subject: mail.subject ?? '',
            text: mail.text ?? '',
            html: typeof mail.html === 'string' ? mail.html : null,
          });
          stored.length = Math.min(stored.length, KEEP);
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve());
  });
  const address = server.server.address();
  return {
    port: typeof address === 'object' && address ? address.port : port,
    messages: () => [...stored],
    clear: () => {
      stored.length = 0;
    },
    close: () => new Promise((resolve) => server.close(() => resolve())),
  };
}
