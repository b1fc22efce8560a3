import PgBoss from 'pg-boss';
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { JobEvent, MailMessage, type MailStatus } from '../../db/models';
import { ConflictError, NotFoundError } from '../../lib/errors';
import type { Mailer, MailMessage as OutgoingMail } from '../../lib/mailer';

const QUEUE = 'mail-send';

export interface MailQueueOptions {
  databaseUrl: string;
  sequelize: Sequelize;
  /** The real transport (SMTP): only the worker calls it. */
  smtp: Mailer;
  /** Retries after the first try; with backoff the wait roughly doubles each time from `retryDelaySeconds`. */
  retryLimit: number;
  retryDelaySeconds: number;
  /** How often an idle worker looks for messages queued by other instances (pg-boss minimum 0.5 s). */
  pollingIntervalSeconds: number;
  /** A job still active after this long is taken as lost (its instance died mid-send) and retried; default 300. */
  sendTimeoutSeconds?: number;
  /** Retries and queue trouble (the server's logger). */
  log: (line: string) => void;
}

/** The durable mail queue: `mailer.send` records and queues; the worker sends. */
export interface MailQueue {
  /** Records the message (and its job history event) and queues it in one transaction; resolves before it is sent. */
  mailer: Mailer;
  /** Installs pg-boss's schema when missing and starts this instance's worker. */
  start(): Promise<void>;
  /** Stops taking new messages and waits for the one being sent. */
  stop(): Promise<void>;
  /** Whether the queue is started and not stopping or stopped (the readiness check). */
  running(): boolean;
  /** Queues a failed message again (409 unless it is `failed`: a waiting or sent one is never sent twice). */
  resend(organisationId: string, id: string): Promise<void>;
  /** Marks failed every waiting message left without a live job (see failOrphans); answers how many. */
  failOrphans(): Promise<number>;
}

/**
 * Why a waiting message with no job left is failed: its last try was cut off (the instance was
 * stopped or killed mid-send and pg-boss expired the job with no retry left), so nothing would ever
 * send it. It may or may not have reached the mail server, so it is not sent again by itself.
 */
export const INTERRUPTED_REASON = 'the last try was interrupted (the server stopped while sending); send it again if it did not arrive';

// A waiting message is alive while one of its jobs may still run. enqueue and resend write the row
// and its job in one transaction and deliver holds the row's lock while its job is active, so the
// guarded UPDATE (still waiting, still no live job) cannot catch a message that is about to be sent.
const FAIL_ORPHANS = `
  UPDATE mail_messages m SET status = 'failed', last_error = $1, updated_at = now()
  WHERE m.status = 'waiting' AND NOT EXISTS (
    SELECT 1 FROM pgboss.job j WHERE j.name = $2 AND j.state IN ('created', 'retry', 'active') AND j.data->>'messageId' = m.id::text)
  RETURNING m.id, m.job_event_id AS "jobEventId", m.recipient, m.subject, m.last_error AS "lastError"`;

/** The history line of an e-mail at each status (the job page shows `text`). */
function eventText(to: string, subject: string, status: MailStatus, reason?: string | null) {
  const state = status === 'sent' ? 'sent' : status === 'failed' ? `not sent: ${reason ?? 'unknown error'}` : 'waiting to be sent';
  return `E-mail to ${to}: ${subject} (${state})`;
}

/** The SMTP error's own words, kept short for the row and the history. */
function reasonOf(err: unknown): string {
  const e = err as { message?: string; response?: string; code?: string };
  return String(e.response || e.message || e.code || err).slice(0, 500);
}

export function createMailQueue(opts: MailQueueOptions): MailQueue {
  const { sequelize, smtp } = opts;
  const { log } = opts;
  const sendTimeout = opts.sendTimeoutSeconds ?? 300;
  // Lost jobs are found by pg-boss's maintenance (one instance per interval): look twice per timeout, at most every 2 min.
  const maintenanceIntervalSeconds = Math.min(120, Math.max(1, Math.round(sendTimeout / 2)));
  const boss = new PgBoss({ connectionString: opts.databaseUrl, max: 3, schedule: false, maintenanceIntervalSeconds });
  // pg-boss reports its own connection trouble here; unheard, an 'error' event would end the process.
  boss.on('error', (err) => log(`queue error: ${reasonOf(err)}`));
  const sendOptions: PgBoss.SendOptions = {
    retryLimit: opts.retryLimit,
    retryDelay: opts.retryDelaySeconds,
    retryBackoff: true,
    // A worker killed mid-send leaves its job active: it is expired and retried after this. A slow
    // send outliving it is no duplicate: the retry waits on the row lock, then finds the row sent.
    expireInSeconds: sendTimeout,
  };
  let workerId: string | null = null;
  let state: 'new' | 'running' | 'stopped' = 'new';
  // pg-boss stops itself too (e.g. after boss.stop from elsewhere): readiness must see it.
  boss.on('stopped', () => {
    state = 'stopped';
  });

  // pg-boss runs its INSERT on our transaction, so the row and its job commit (or vanish) together.
  const onTransaction = (transaction: Transaction): PgBoss.Db => ({
    async executeSql(text, values) {
      // pg-boss leaves trailing unset parameters out (pg reads them as NULL); Sequelize wants each one.
      const highest = Math.max(0, ...[...text.matchAll(/\$(\d+)/g)].map((m) => Number(m[1])));
      const bind = Array.from({ length: Math.max(highest, values.length) }, (_, i) => values[i] ?? null);
      const rows = await sequelize.query(text, { bind, transaction, type: QueryTypes.SELECT });
      return { rows };
    },
  });

  async function setEventStatus(row: Pick<MailMessage, 'jobEventId' | 'recipient' | 'subject' | 'lastError'>, status: MailStatus, transaction?: Transaction) {
    if (!row.jobEventId) return;
    const patch = { status, reason: row.lastError, text: eventText(row.recipient, row.subject, status, row.lastError) };
    await sequelize.query('UPDATE job_events SET data = data || $1::jsonb WHERE id = $2', { bind: [JSON.stringify(patch), row.jobEventId], transaction });
  }

  async function enqueue(message: OutgoingMail) {
    const { about } = message;
    await sequelize.transaction(async (transaction) => {
      let jobEventId: string | null = null;
      if (about?.jobId && message.organisationId) {
        const event = await JobEvent.create(
          {
            organisationId: message.organisationId,
            jobId: about.jobId,
            userId: about.userId,
            kind: 'email_sent',
            data: {
              text: eventText(message.to, message.subject, 'waiting'),
              to: message.to,
              subject: message.subject,
              purpose: about.purpose,
              quoteId: about.quoteId ?? null,
              attachments: (message.attachments ?? []).map((a) => a.filename),
              status: 'waiting',
            },
          } as never,
          { transaction },
        );
        jobEventId = event.id;
      }
      const row = await MailMessage.create(
        {
          organisationId: message.organisationId ?? null,
          jobId: about?.jobId ?? null,
          jobEventId,
          purpose: about?.purpose ?? '',
          recipient: message.to,
          replyTo: message.replyTo ?? null,
          subject: message.subject,
          text: message.text,
          html: message.html ?? null,
          attachments: (message.attachments ?? []).map((a) => ({
            filename: a.filename,
            contentType: a.contentType,
            contentBase64: a.content.toString('base64'),
          })),
          lastError: null,
          sentAt: null,
        },
        { transaction },
      );
      await boss.send(QUEUE, { messageId: row.id }, { ...sendOptions, db: onTransaction(transaction) });
    });
    if (workerId) boss.notifyWorker(workerId);
  }

  /** Sends one message under its row lock: a second job for the same row waits, then finds it sent. */
  async function deliver(messageId: string, lastTry: boolean) {
    try {
      await sequelize.transaction(async (transaction) => {
        const row = await MailMessage.findByPk(messageId, { transaction, lock: transaction.LOCK.UPDATE });
        if (!row || row.status !== 'waiting') return;
        await smtp.send({
          to: row.recipient,
          organisationId: row.organisationId ?? undefined,
          replyTo: row.replyTo ?? undefined,
          subject: row.subject,
          text: row.text,
          html: row.html ?? undefined,
          attachments: row.attachments.map((a) => ({ filename: a.filename, contentType: a.contentType, content: Buffer.from(a.contentBase64, 'base64') })),
        });
        await row.update({ status: 'sent', sentAt: new Date(), lastError: null, attempts: row.attempts + 1 }, { transaction });
        await setEventStatus(row, 'sent', transaction);
      });
    } catch (err) {
      const row = await MailMessage.findByPk(messageId);
      if (row?.status === 'waiting') {
        await row.update({ attempts: row.attempts + 1, lastError: reasonOf(err), status: lastTry ? 'failed' : 'waiting' });
        await setEventStatus(row, row.status);
      }
      if (!lastTry) log(`will retry message ${messageId}: ${reasonOf(err)}`);
      throw err; // pg-boss schedules the retry with backoff
    }
  }

  async function failOrphans(): Promise<number> {
    return sequelize.transaction(async (transaction) => {
      const rows = await sequelize.query<{ id: string; jobEventId: string | null; recipient: string; subject: string; lastError: string }>(FAIL_ORPHANS, {
        bind: [INTERRUPTED_REASON, QUEUE],
        transaction,
        type: QueryTypes.SELECT,
      });
      for (const row of rows) await setEventStatus(row, 'failed', transaction);
      if (rows.length) log(`${rows.length} waiting message(s) had no job left after an interrupted last try: marked failed`);
      return rows.length;
    });
  }
  let sweep: NodeJS.Timeout | null = null;

  return {
    mailer: { send: enqueue, close: () => undefined },
    failOrphans,
    async start() {
      await boss.start();
      await boss.createQueue(QUEUE);
      workerId = await boss.work<{ messageId: string }>(QUEUE, { pollingIntervalSeconds: opts.pollingIntervalSeconds, includeMetadata: true }, async ([job]) =>
        deliver(job.data.messageId, job.retryCount >= job.retryLimit),
      );
      state = 'running';
      // Every instance sweeps (the guarded UPDATE makes overlapping sweeps harmless) as often as
      // pg-boss's maintenance expires lost jobs; index.ts sweeps once more after the migrations
      // (this runs before them, on a database that may not have the table yet).
      sweep = setInterval(() => failOrphans().catch((e: unknown) => log(`orphan sweep: ${reasonOf(e)}`)), maintenanceIntervalSeconds * 1000);
      sweep.unref();
    },
    async stop() {
      if (sweep) clearInterval(sweep);
      sweep = null;
      if (state === 'stopped') return;
      state = 'stopped';
      // graceful: the message being sent finishes (or fails and is retried by another instance);
      // one still active past the timeout is left to pg-boss's expiry and retried, never dropped.
      await boss.stop({ graceful: true, wait: true, timeout: 10_000 });
    },
    running: () => state === 'running',
    async resend(organisationId, id) {
      await sequelize.transaction(async (transaction) => {
        const row = await MailMessage.findOne({ where: { id, organisationId }, transaction, lock: transaction.LOCK.UPDATE });
        if (!row) throw new NotFoundError('message');
        if (row.status !== 'failed') throw new ConflictError(`this message is ${row.status}; only a failed message can be sent again`, 'not_failed');
        await row.update({ status: 'waiting', lastError: null }, { transaction });
        await setEventStatus(row, 'waiting', transaction);
        await boss.send(QUEUE, { messageId: row.id }, { ...sendOptions, db: onTransaction(transaction) });
      });
      if (workerId) boss.notifyWorker(workerId);
    },
  };
}
