import pg from 'pg';
import type { Sequelize } from 'sequelize';
import type { Config } from './config';
import { createSequelize } from './db/sequelize';
import { FakeSmtp, type Outbox } from './lib/fake-smtp';
import { createLogger, type Logger } from './lib/logger';
import { createSmtpMailer, type Mailer } from './lib/mailer';
import { createMailQueue, type MailQueue } from './modules/mail/mail-queue';
import { createStorage, type Storage } from './lib/storage';
import { createPlanPool, type PlanPool } from './lib/takeoff-pool';

/** Everything createApp needs from the outside world; tests build their own. */
export interface AppDeps {
  config: Config;
  /** Structured JSON log (pino); one line per request from request-log.ts. */
  logger: Logger;
  sequelize: Sequelize;
  /** A pg pool for the hot raw reads: the session with its user, the editor's plan read. */
  pool: pg.Pool;
  /** Records and queues a message, resolving before it is sent (see mailQueue). */
  mailer: Mailer;
  /** The durable queue behind `mailer` and this instance's worker that sends through SMTP. */
  mailQueue: MailQueue;
  storage: Storage;
  /** The local fake SMTP's messages, when it runs (development and tests); null with a real relay. */
  outbox: Outbox | null;
  /** Worker threads that validate plans and compute takeoffs off the request thread. */
  planPool: PlanPool;
  /** Set by the shutdown (server/lib/shutdown.ts): readiness answers 503 while it drains. */
  lifecycle: { draining: boolean };
  close(): Promise<void>;
}

/**
 * Builds the deps from config: Sequelize + pool on DATABASE_URL, the mail queue and its worker
 * sending to SMTP_URL or to an in-process fake SMTP server on 127.0.0.1, upload storage (the
 * UPLOAD_DIR folder or an S3 bucket, STORAGE_DRIVER) and the takeoff worker pool.
 */
export async function createDeps(config: Config, opts: { sequelize?: Sequelize } = {}): Promise<AppDeps> {
  const logger = createLogger({ level: config.logLevel });
  const storage = createStorage(config.storage);
  // The folder drops half-written uploads of a process that died (kill -9, power loss); S3 checks
  // its bucket answers, so a wrong name or key stops the start rather than the first upload.
  const prepared = await storage.prepare();
  if (prepared) logger.info(`storage: ${prepared}`);
  // Sequelize models are classes bound to one instance: one per process. Tests that build several
  // apps pass the shared instance in (and close it themselves).
  const sequelize = opts.sequelize ?? createSequelize(config.databaseUrl, { logSql: config.logSql, log: (sql) => logger.info({ sql }, 'sql') });
  const pool = new pg.Pool({ connectionString: config.databaseUrl, max: 5 });
  // An idle client whose server went away (PostgreSQL restarted) emits 'error' on the pool; unheard,
  // it would end the process. The pool drops that client and connects afresh on the next request.
  pool.on('error', (err) => logger.warn(`session pool: idle connection lost (${err.message})`));
  let fake: FakeSmtp | null = null;
  let smtp: Mailer;
  if (config.smtpUrl) {
    smtp = createSmtpMailer({ url: config.smtpUrl }, config.mailFrom);
  } else {
    if (config.isProduction) throw new Error('SMTP_URL is required when NODE_ENV=production');
    fake = new FakeSmtp();
    const port = await fake.start(config.fakeSmtpPort);
    smtp = createSmtpMailer({ host: '127.0.0.1', port }, config.mailFrom);
  }
  const mailQueue = createMailQueue({
    databaseUrl: config.databaseUrl,
    sequelize,
    smtp,
    retryLimit: config.mailRetryLimit,
    retryDelaySeconds: config.mailRetryDelaySeconds,
    pollingIntervalSeconds: config.mailPollSeconds,
    sendTimeoutSeconds: config.mailSendTimeoutSeconds,
    log: (line) => logger.warn({ module: 'mail' }, line),
  });
  await mailQueue.start();
  const planPool = createPlanPool({ threads: config.takeoffWorkers, timeLimitMs: config.takeoffTimeLimitMs });
  return {
    config,
    logger,
    sequelize,
    pool,
    mailer: mailQueue.mailer,
    mailQueue,
    storage,
    outbox: fake,
    planPool,
    lifecycle: { draining: false },
    async close() {
      await mailQueue.stop();
      await planPool.close();
      smtp.close();
      await fake?.stop();
      await pool.end();
      storage.close();
      if (!opts.sequelize) await sequelize.close();
    },
  };
}
