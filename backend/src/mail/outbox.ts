/**
 * Mail goes out after the answer: a request adds a row to mail_outbox; a loop in every app process (and the
 * tests, synchronously, with drainOutbox) claims rows with FOR UPDATE SKIP LOCKED and hands them to SMTP.
 * A failed attempt is retried later; after MAX_ATTEMPTS the row stays with its error for someone to read.
 */
import { hostname } from 'node:os';
import { randomBytes } from 'node:crypto';
import type { DataSource, EntityManager } from 'typeorm';
import { MailOutbox } from '../entities/mail-outbox.entity.js';
import type { Logger } from '../logger.js';
import type { Mailer, OutgoingMail } from './mailer.js';

export const MAX_ATTEMPTS = 5;
/** A claim older than this belongs to a process that died mid-delivery: another may take the row over. */
const STALE_CLAIM_MINUTES = 5;
const retryDelayMs = (attempts: number) => Math.min(30 * 60_000, 30_000 * 2 ** (attempts - 1));

/** Turns a row whose mail is written at delivery into the mail; null means there is nothing to send. */
export type MailComposer = (ds: DataSource, recipient: string) => Promise<OutgoingMail | null>;

export interface OutboxDelivery {
  transport: Mailer;
  composers: Record<string, MailComposer>;
}

export async function enqueueMail(ds: DataSource | EntityManager, mail: OutgoingMail): Promise<void> {
  await ds
    .getRepository(MailOutbox)
    .insert({ kind: 'message', recipient: mail.to, subject: mail.subject, body: mail.text, availableAt: new Date(), attempts: 0 });
}

/** A row whose mail is composed at delivery by the composer of `kind` (e.g. a reset link, only if the account exists). */
export async function enqueueComposed(ds: DataSource | EntityManager, kind: string, recipient: string): Promise<void> {
  await ds.getRepository(MailOutbox).insert({ kind, recipient, subject: '', body: null, availableAt: new Date(), attempts: 0 });
}

async function claimNext(ds: DataSource, claimant: string): Promise<MailOutbox | null> {
  return ds.transaction(async (em) => {
    const rows: { id: string }[] = await em.query(
      `SELECT id FROM mail_outbox
        WHERE failedAt IS NULL AND availableAt <= NOW(3)
          AND (claimedAt IS NULL OR claimedAt < NOW(3) - INTERVAL ${STALE_CLAIM_MINUTES} MINUTE)
        ORDER BY availableAt ASC LIMIT 1 FOR UPDATE SKIP LOCKED`,
    );
    const [due] = rows;
    if (!due) return null;
    await em.query('UPDATE mail_outbox SET claimedBy = ?, claimedAt = NOW(3), attempts = attempts + 1 WHERE id = ?', [claimant, due.id]);
    return em.getRepository(MailOutbox).findOneByOrFail({ id: due.id });
  });
}

async function deliverOne(ds: DataSource, delivery: OutboxDelivery, claimant: string, logger?: Logger): Promise<boolean> {
  const row = await claimNext(ds, claimant);
  if (!row) return false;
  try {
    let mail: OutgoingMail | null;
    if (row.kind === 'message') mail = { to: row.recipient, subject: row.subject, text: row.body ?? '' };
    else {
      const compose = delivery.composers[row.kind];
      if (!compose) throw new Error(`no composer for mail kind ${row.kind}`);
      mail = await compose(ds, row.recipient);
    }
    if (mail) await delivery.transport.send(mail);
    await ds.getRepository(MailOutbox).delete({ id: row.id, claimedBy: claimant });
  } catch (err) {
    const message = (err instanceof Error ? err.message : String(err)).slice(0, 500);
    const failed = row.attempts >= MAX_ATTEMPTS;
    logger?.warn(
      { err: message, kind: row.kind, attempts: row.attempts },
      failed ? 'mail could not be delivered; giving up' : 'mail delivery failed; will retry',
    );
    await ds.getRepository(MailOutbox).update(
      { id: row.id, claimedBy: claimant },
      {
        claimedBy: null,
        claimedAt: null,
        lastError: message,
        availableAt: new Date(Date.now() + retryDelayMs(row.attempts)),
        failedAt: failed ? new Date() : null,
      },
    );
  }
  return true;
}

const claimantId = () => `${hostname()}:${process.pid}:${randomBytes(3).toString('hex')}`;

/** Delivers everything due now, one row after another (tests and scripts); returns how many rows it handled. */
export async function drainOutbox(ds: DataSource, delivery: OutboxDelivery, logger?: Logger): Promise<number> {
  const claimant = claimantId();
  let count = 0;
  while (await deliverOne(ds, delivery, claimant, logger)) count++;
  return count;
}

export interface OutboxWorker {
  /** Stops claiming; waits for a delivery in progress at most `graceMs` (its row is retried by anyone later). */
  stop: (graceMs?: number) => Promise<void>;
}

export function startOutboxWorker(ds: DataSource, delivery: OutboxDelivery, logger: Logger, pollMs = 500): OutboxWorker {
  const claimant = claimantId();
  let stopped = false;
  let running: Promise<void> = Promise.resolve();
  const tick = async () => {
    while (!stopped && (await deliverOne(ds, delivery, claimant, logger)));
  };
  const timer = setInterval(() => {
    running = running.then(tick).catch((err) => logger.error({ err }, 'mail delivery loop failed'));
  }, pollMs);
  return {
    stop: async (graceMs = 5_000) => {
      stopped = true;
      clearInterval(timer);
      let timeout: NodeJS.Timeout | undefined;
      await Promise.race([running, new Promise<void>((resolve) => (timeout = setTimeout(resolve, graceMs)))]);
      clearTimeout(timeout);
    },
  };
}
