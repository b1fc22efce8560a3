// Two app instances (the real server, each its own process) on one database and one S3-compatible
// store (s3rver), sending through one SMTP server the test controls: sessions, uploads, sign-in
// limits and the mail queue are shared, and a killed instance loses no e-mail.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { QueryTypes, type Sequelize } from 'sequelize';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MailMessage } from '../../server/db/models';
import { createSequelize } from '../../server/db/sequelize';
import { startAppProcess, until, type AppProcess } from '../helpers/app-process';
import { startS3Fake, type S3Fake } from '../helpers/s3-fake';
import { SmtpGate } from '../helpers/smtp-gate';
import { testDatabaseUrl } from '../helpers/test-app';
import { rotatedJpeg, scheduledJobWithTakeoff } from './job-sheet-fixtures';
import { binary, quoteCompany, quoteJob } from './quotes-fixtures';

const LONG = 120_000; // generous bound for anything that waits on the other processes

let sequelize: Sequelize;
let s3: S3Fake;
const smtp = new SmtpGate();
const apps: Record<'a' | 'b', AppProcess> = {} as never;
const dirs: string[] = [];
let org: Awaited<ReturnType<typeof quoteCompany>>;

beforeAll(async () => {
  const databaseUrl = testDatabaseUrl();
  sequelize = createSequelize(databaseUrl); // the test's own view of the database (models for set-up and checks)
  s3 = await startS3Fake();
  await smtp.start();
  const start = (name: 'a' | 'b') => {
    const uploadDir = fs.mkdtempSync(path.join(os.tmpdir(), `quiltline-instance-${name}-`));
    dirs.push(uploadDir);
    return startAppProcess(`instance-${name}`, {
      DATABASE_URL: databaseUrl,
      MIGRATE_ON_START: '0',
      SEED_DEMO: '0',
      UPLOAD_DIR: uploadDir,
      ...s3.env,
      // Each instance names itself in EHLO, so the test knows whose send it holds.
      SMTP_URL: `smtp://127.0.0.1:${smtp.port}/?name=instance-${name}`,
      LOGIN_RATE_LIMIT: '4',
      TRUST_PROXY: '1',
      MAIL_RETRY_DELAY_SECONDS: '1',
      MAIL_SEND_TIMEOUT_SECONDS: '4',
      TAKEOFF_WORKERS: '1',
      LOG_LEVEL: 'silent',
    });
  };
  [apps.a, apps.b] = await Promise.all([start('a'), start('b')]);
  org = await quoteCompany();
}, 240_000);

afterAll(async () => {
  await Promise.all(Object.values(apps).map((a) => a?.stop()));
  await smtp.stop();
  await s3?.close();
  await sequelize?.close();
  for (const d of dirs) fs.rmSync(d, { recursive: true, force: true });
}, LONG);

/** Signs in on one instance; returns the session cookie. */
async function signIn(app: AppProcess, user: { email: string; password: string }): Promise<string> {
  const res = await request(app.url).post('/api/auth/login').send(user);
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return String(res.headers['set-cookie']).split(';')[0];
}

/** The pg-boss jobs of one message, by state (a retried job keeps its row). */
async function jobStates(messageId: string): Promise<string[]> {
  const rows = await sequelize.query<{ state: string }>("SELECT state FROM pgboss.job WHERE name = 'mail-send' AND data->>'messageId' = $1", {
    bind: [messageId],
    type: QueryTypes.SELECT,
  });
  return rows.map((r) => r.state);
}

/** Sends a new quote for a customer of its own through `app`; resolves with its mail row once recorded. */
async function sendQuote(app: AppProcess, customerEmail: string) {
  const { job } = await quoteJob(org, { email: customerEmail });
  const cookie = await signIn(app, org.office);
  const created = await request(app.url).post(`/api/jobs/${job.id}/quotes`).set('Cookie', cookie).send({});
  expect(created.status, JSON.stringify(created.body)).toBe(201);
  const sent = await request(app.url).post(`/api/quotes/${created.body.quote.id}/send`).set('Cookie', cookie).send({});
  expect(sent.status, JSON.stringify(sent.body)).toBe(200);
  return MailMessage.findOne({ where: { recipient: customerEmail }, rejectOnEmpty: true });
}

/** Waits until the message is sent and its job completed, then returns the messages the SMTP server accepted for it. */
async function deliveredOnce(row: MailMessage) {
  await until('the message marked sent', LONG, async () => ((await row.reload()).status === 'sent' ? true : undefined));
  await until('its queue job completed', LONG, async () => ((await jobStates(row.id)).every((s) => s === 'completed') ? true : undefined));
  return smtp.accepted.filter((m) => m.to.includes(row.recipient));
}

describe('two app instances on one database and one object store', () => {
  it('accepts a session made on one instance on the other, and a sign-out on the other ends it on both', async () => {
    const cookie = await signIn(apps.a, org.estimator);
    const me = await request(apps.b.url).get('/api/auth/me').set('Cookie', cookie);
    expect(me.status).toBe(200);
    expect(me.body.user.email).toBe(org.estimator.email);
    expect((await request(apps.b.url).post('/api/auth/logout').set('Cookie', cookie).send()).status).toBeLessThan(300);
    expect((await request(apps.a.url).get('/api/auth/me').set('Cookie', cookie)).status).toBe(401);
  });

  it('serves from one instance a photo uploaded through the other', async () => {
    const { job, space } = await scheduledJobWithTakeoff(org);
    const cookie = await signIn(apps.a, org.installer);
    const up = await request(apps.a.url)
      .post(`/api/jobs/${job.id}/photos`)
      .set('Cookie', cookie)
      .set('Idempotency-Key', `two-instances-${job.id}`)
      .field('spaceId', space.id)
      .field('stage', 'before')
      .field('caption', 'Hatch before')
      .attach('photo', await rotatedJpeg(), { filename: 'IMG_0002.JPG', contentType: 'image/jpeg' });
    expect(up.status, JSON.stringify(up.body)).toBe(201);
    const fromA = await request(apps.a.url).get(up.body.photo.url).set('Cookie', cookie).buffer(true).parse(binary);
    const fromB = await request(apps.b.url).get(up.body.photo.url).set('Cookie', cookie).buffer(true).parse(binary);
    expect(fromB.status).toBe(200);
    expect(fromB.headers['content-type']).toBe('image/jpeg');
    expect((fromB.body as Buffer).length).toBeGreaterThan(0);
    expect((fromB.body as Buffer).equals(fromA.body as Buffer)).toBe(true);
    // Neither instance kept it on its own disk.
    for (const d of dirs) expect(fs.readdirSync(d, { recursive: true }).filter((f) => String(f).endsWith('.jpg'))).toEqual([]);
  });

  it('limits sign-in failures spread over both instances as one', async () => {
    const from = '203.0.113.90';
    const login = (app: AppProcess, password: string) =>
      request(app.url).post('/api/auth/login').set('X-Forwarded-For', from).send({ email: org.estimator.email, password });
    // LOGIN_RATE_LIMIT 4: four failures per account, two on each instance.
    for (let i = 0; i < 4; i++) expect((await login(i % 2 ? apps.b : apps.a, `wrong-${i}`)).status).toBe(401);
    expect((await login(apps.a, org.estimator.password)).status).toBe(429);
    expect((await login(apps.b, org.estimator.password)).status).toBe(429);
  });

  it(
    'sends a quote e-mailed while the mail server was down once it is back, once',
    async () => {
      await smtp.stop();
      const row = await sendQuote(apps.a, 'down.then.up@example.com');
      // At least one try failed against the closed port before the server comes back.
      await until('a failed try recorded', LONG, async () => ((await row.reload()).attempts >= 1 && row.lastError ? true : undefined));
      expect(row.status).toBe('waiting');
      await smtp.start();
      const got = await deliveredOnce(row);
      expect(got).toHaveLength(1);
      expect(got[0].subject).toMatch(/quote/i);
    },
    3 * LONG,
  );

  it(
    'loses no message when the instance sending it is killed mid-send: the other sends it, once',
    async () => {
      const held = smtp.holdNext();
      const row = await sendQuote(apps.b, 'killed.mid.send@example.com');
      // One instance's worker has sent the whole message and waits for the server's answer.
      const sender = await held;
      const [victim, survivor] = sender === 'instance-a' ? [apps.a, apps.b] : [apps.b, apps.a];
      expect(victim.name).toBe(sender);
      await victim.stop('SIGKILL');
      smtp.release();
      const got = await deliveredOnce(row);
      expect(got).toEqual([expect.objectContaining({ client: survivor.name })]);
      expect(row.status).toBe('sent');
    },
    3 * LONG,
  );
});
