// Builds the real app (createApp) on this run's test database, with the in-process fake SMTP.
import { randomUUID } from 'node:crypto';
import os from 'node:os';
import path from 'node:path';
import fs from 'node:fs';
import bcrypt from 'bcryptjs';
import type { Express } from 'express';
import request from 'supertest';
import { inject } from 'vitest';
import type { JobStage } from '../../shared/api/jobs';
import type { Role } from '../../shared/auth/roles';
import { createApp } from '../../server/app';
import { loadConfig, type Config } from '../../server/config';
import { Customer, Job, Organisation, Space, User } from '../../server/db/models';
import { createDeps, type AppDeps } from '../../server/deps';
import { createSequelize } from '../../server/db/sequelize';
import type { Sequelize } from 'sequelize';
import type { FakeSmtp } from '../../server/lib/fake-smtp';
import { nextJobReference } from '../../server/modules/jobs/job-reference';
import { storePlanRevision } from '../../server/modules/plan-revisions/plan-takeoff';
import { createCompanyDefaults } from '../../server/modules/settings/settings.service';
import type { Plan } from '../../shared/plan/plan-schema';
import '../../server/types';

export interface TestContext {
  app: Express;
  deps: AppDeps;
  config: Config;
  /** The fake SMTP server: messages(), clear(), waitFor(predicate). */
  outbox: FakeSmtp;
  close(): Promise<void>;
}

// Models are bound to one Sequelize instance per process, so every context in a test file shares
// one (closed when the last context closes).
let shared: { sequelize: Sequelize; refs: number } | null = null;
function acquireSequelize(url: string): Sequelize {
  shared ??= { sequelize: createSequelize(url), refs: 0 };
  shared.refs++;
  return shared.sequelize;
}
async function releaseSequelize() {
  if (!shared || --shared.refs > 0) return;
  const s = shared.sequelize;
  shared = null;
  await s.close();
}

/**
 * The URL of this worker's database (created and migrated by tests/helpers/global-setup.ts; one
 * per worker, so the test files sharing it run one at a time).
 */
export function testDatabaseUrl(): string {
  const urls = inject('databaseUrls');
  if (!urls?.length) return inject('databaseUrl') ?? process.env.TEST_DATABASE_URL!;
  const worker = Math.max(1, Number(process.env.VITEST_POOL_ID ?? 1));
  return urls[(worker - 1) % urls.length];
}

/**
 * A fresh app on the test database with its own fake SMTP server and a temporary uploads folder.
 * `env` overrides environment variables (e.g. `{ LOGIN_RATE_LIMIT: '3' }`). Call close() in afterAll.
 */
export async function createTestContext(env: Record<string, string> = {}): Promise<TestContext> {
  const uploadDir = fs.mkdtempSync(path.join(os.tmpdir(), 'quiltline-uploads-'));
  const config = loadConfig({
    NODE_ENV: 'test',
    DATABASE_URL: testDatabaseUrl(),
    UPLOAD_DIR: uploadDir,
    APP_URL: 'http://127.0.0.1:3000',
    LOGIN_RATE_LIMIT: '10000',
    ...env,
  });
  const deps = await createDeps(config, { sequelize: acquireSequelize(config.databaseUrl) });
  const app = createApp(deps);
  return {
    app,
    deps,
    config,
    outbox: deps.outbox as FakeSmtp,
    async close() {
      await deps.close();
      await releaseSequelize();
      fs.rmSync(uploadDir, { recursive: true, force: true });
    },
  };
}

export const TEST_PASSWORD = 'correct-horse-battery';

export interface TestUser {
  id: string;
  email: string;
  name: string;
  role: Role;
  password: string;
  organisationId: string;
}

export interface TestOrg {
  id: string;
  name: string;
  office: TestUser;
  estimator: TestUser;
  installer: TestUser;
}

let passwordHash: string | undefined;

/** A user in an organisation, with a unique e-mail so test files never collide. */
export async function createUser(
  organisationId: string,
  role: Role,
  opts: { name?: string; active?: boolean; password?: string | null } = {},
): Promise<TestUser> {
  const tag = randomUUID().slice(0, 8);
  const password = opts.password === undefined ? TEST_PASSWORD : opts.password;
  passwordHash ??= await bcrypt.hash(TEST_PASSWORD, 4);
  const hash = password === null ? null : password === TEST_PASSWORD ? passwordHash : await bcrypt.hash(password, 4);
  const u = await User.create({
    organisationId,
    email: `${role}-${tag}@test.example.com`,
    name: opts.name ?? `${role[0].toUpperCase()}${role.slice(1)} ${tag}`,
    role,
    passwordHash: hash,
    active: opts.active ?? true,
  });
  return { id: u.id, email: u.email, name: u.name, role, password: password ?? '', organisationId };
}

/** A company with one office user, one estimator and one installer. */
export async function createOrgWithUsers(_ctx?: TestContext, name = `Test Loft Co ${randomUUID().slice(0, 6)}`): Promise<TestOrg> {
  const org = await Organisation.create({ name });
  await createCompanyDefaults(org.id, name);
  return {
    id: org.id,
    name: org.name,
    office: await createUser(org.id, 'office'),
    estimator: await createUser(org.id, 'estimator'),
    installer: await createUser(org.id, 'installer'),
  };
}

/** A customer and a job (with one space holding `plan` as revision 1 when given). */
export async function createJob(
  org: Pick<TestOrg, 'id'>,
  opts: { stage?: JobStage; assignedInstallerId?: string | null; customerName?: string; plan?: Plan; spaceName?: string } = {},
) {
  const customer = await Customer.create({
    organisationId: org.id,
    name: opts.customerName ?? `Customer ${randomUUID().slice(0, 6)}`,
    email: '',
    phone: '',
    addressLine1: '1 Test Street',
    addressLine2: '',
    town: 'Testbury',
    postcode: 'TE1 1ST',
  });
  const job = await Job.create({
    organisationId: org.id,
    reference: await nextJobReference(Job.sequelize!, org.id),
    customerId: customer.id,
    addressLine1: '1 Test Street',
    addressLine2: '',
    town: 'Testbury',
    postcode: 'TE1 1ST',
    stage: opts.stage ?? 'enquiry',
    assignedInstallerId: opts.assignedInstallerId ?? null,
    installDate: null,
    accessNotes: '',
    notes: '',
    createdById: null,
  });
  const space = await Space.create({ organisationId: org.id, jobId: job.id, name: opts.spaceName ?? 'Main loft' });
  // Stored the way every writer stores a revision: with its takeoff from the company's catalogue and settings.
  if (opts.plan) await storePlanRevision(Job.sequelize!, { organisationId: org.id, spaceId: space.id, authorId: null, plan: opts.plan });
  return { customer, job, space };
}

/** A supertest agent signed in as this user (cookies kept between requests). */
export async function loginAs(app: Express, user: Pick<TestUser, 'email' | 'password'>) {
  const agent = request.agent(app);
  const res = await agent.post('/api/auth/login').send({ email: user.email, password: user.password });
  if (res.status !== 200) throw new Error(`loginAs(${user.email}) failed: ${res.status} ${JSON.stringify(res.body)}`);
  return agent;
}

/** The `token` query parameter of the first link in an e-mail that points at `pathPrefix`. */
export function tokenFromLink(links: string[], pathPrefix: string): string {
  const link = links.find((l) => new URL(l).pathname === pathPrefix);
  if (!link) throw new Error(`no ${pathPrefix} link among ${JSON.stringify(links)}`);
  const token = new URL(link).searchParams.get('token');
  if (!token) throw new Error(`link without token: ${link}`);
  return token;
}
