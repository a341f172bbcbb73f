/**
 * Local SMTP sink for development and tests: accepts every message on loopback, keeps it in MariaDB
 * (sink_message, so every app process shows the same mail on the mailbox page) and prints it for the terminal,
 * so someone who cannot sign in can still follow a reset link in a local run. Off whenever SMTP_URL is set,
 * and only ever on a loopback HOST (config refuses anything else).
 */
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import { LessThan, MoreThanOrEqual, type DataSource } from 'typeorm';
import { SinkMessage } from '../entities/sink-message.entity.js';

export interface SmtpSink {
  port: number;
  close: () => Promise<void>;
}

export interface SinkMessageView {
  id: string;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
}

/** Sink mail older than this is dropped when new mail arrives. */
const KEEP_DAYS = 30;

export function formatForTerminal(m: { from: string; to: string; subject: string; text: string }): string {
  return [`Mail to ${m.to} — ${m.subject}`, ...m.text.split('\n').map((l) => `  | ${l}`)].join('\n');
}

export async function startSmtpSink(options: { port: number; dataSource: DataSource; print?: (text: string) => void }): Promise<SmtpSink> {
  const { dataSource, print } = options;
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    // Stopping waits at most this long for open client connections (the default is 30 s).
    closeTimeout: 1_000,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then(async (mail) => {
          const recipients = (session.envelope.rcptTo ?? []).map((r) => r.address.toLowerCase());
          const base = {
            sender: (mail.from?.text ?? '').slice(0, 300),
            subject: (mail.subject ?? '').slice(0, 300),
            body: mail.text ?? '',
            receivedAt: new Date(),
          };
          const repo = dataSource.getRepository(SinkMessage);
          for (const recipient of recipients) {
            await repo.insert({ ...base, recipient });
            print?.(formatForTerminal({ from: base.sender, to: recipient, subject: base.subject, text: base.body }));
          }
          await repo.delete({ receivedAt: LessThan(new Date(Date.now() - KEEP_DAYS * 86_400_000)) });
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(options.port, '127.0.0.1', () => resolve());
  });
  const address = server.server.address();
  return {
    port: typeof address === 'object' && address ? address.port : options.port,
    close: () => new Promise((resolve) => server.close(() => resolve())),
  };
}

/** The mail the sink received for one address (only from `since` on, when given), newest first. */
export async function sinkMessagesFor(ds: DataSource, email: string, options: { since?: Date; limit?: number } = {}): Promise<SinkMessageView[]> {
  const where = { recipient: email.toLowerCase(), ...(options.since && { receivedAt: MoreThanOrEqual(options.since) }) };
  const rows = await ds.getRepository(SinkMessage).find({ where, order: { receivedAt: 'DESC' }, take: options.limit ?? 200 });
  return rows.map((r) => ({ id: r.id, receivedAt: r.receivedAt.toISOString(), from: r.sender, to: [r.recipient], subject: r.subject, text: r.body }));
}
