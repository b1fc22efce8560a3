import fs from 'node:fs';
import path from 'node:path';
import bcrypt from 'bcryptjs';
import type { JobStage } from '../../../shared/api/jobs';
import type { Role } from '../../../shared/auth/roles';
import { planSchema, type Plan } from '../../../shared/plan/plan-schema';
import { validatePlan } from '../../../shared/plan/validate-plan';
import { REPO_ROOT } from '../../config';
import type { AppDeps } from '../../deps';
import { addDaysIso, todayIso } from '../../../shared/dates';
import { Customer, Job, Organisation, Space, User } from '../models';
import { nextJobReference } from '../../modules/jobs/job-reference';
import { companyTakeoffInputs, storePlanRevision } from '../../modules/plan-revisions/plan-takeoff';
import { createCompanyDefaults, seedDemoCatalogue } from '../../modules/settings/settings.service';
import { seedDemoActuals } from './actuals-demo';
import { demoStagePath, demoTimes, seedDemoHistory, type DemoTimes } from './demo-history';
import { seedDemoDocuments } from './documents-demo';

/** Demo-only password, shown in the README. */
export const DEMO_PASSWORD = 'quiltline-demo';
export const DEMO_COMPANY = 'Hearthfold Insulation Ltd';
export const OTHER_COMPANY = 'Northgate Loft Co';

// An invented scenario: companies, people and addresses are made up; e-mails use example.com.
const DEMO_USERS: Array<{ key: string; email: string; name: string; role: Role }> = [
  { key: 'office', email: 'office@demo.example.com', name: 'Olivia Marsh', role: 'office' },
  { key: 'estimator', email: 'estimator@demo.example.com', name: 'Ellis Harper', role: 'estimator' },
  { key: 'estimator2', email: 'estimator2@demo.example.com', name: 'Priya Nandakumar', role: 'estimator' },
  { key: 'installer', email: 'installer@demo.example.com', name: 'Ian Calder', role: 'installer' },
  { key: 'installer2', email: 'installer2@demo.example.com', name: 'Tomasz Weller', role: 'installer' },
];
const OTHER_USERS: typeof DEMO_USERS = [
  { key: 'office', email: 'office@northgate.example.com', name: 'Nadia Brook', role: 'office' },
  { key: 'estimator', email: 'estimator@northgate.example.com', name: 'Callum Reid', role: 'estimator' },
  { key: 'installer', email: 'installer@northgate.example.com', name: 'Dev Okafor', role: 'installer' },
];

type DemoJob = {
  customer: string;
  email: string;
  phone: string;
  line1: string;
  town: string;
  postcode: string;
  stage: JobStage;
  installer?: 'installer' | 'installer2';
  /** Days from the seeding day to the install (negative: done already), so the history always fits before now. */
  installInDays?: number;
  estimator: 'estimator' | 'estimator2';
  spaces: string[];
  accessNotes?: string;
  notes?: string;
};

const DEMO_JOBS: DemoJob[] = [
  {
    customer: 'Harriet Quayle',
    email: 'harriet.quayle@example.com',
    phone: '01632 960101',
    line1: '14 Wrenfield Road',
    town: 'Ashcombe',
    postcode: 'AB1 2CD',
    stage: 'enquiry',
    estimator: 'estimator',
    spaces: ['Main loft'],
    notes: 'Asked about topping up after a cold winter.',
  },
  {
    customer: 'Gideon Pell',
    email: 'g.pell@example.com',
    phone: '01632 960102',
    line1: '3 Tanner Close',
    town: 'Ashcombe',
    postcode: 'AB1 4EF',
    stage: 'surveyed',
    estimator: 'estimator',
    spaces: ['Main loft', 'Garage loft'],
    accessNotes: 'Hatch on the landing; ladder in the garage.',
  },
  {
    customer: 'Mei Lin Hartley',
    email: 'meilin.hartley@example.com',
    phone: '01632 960103',
    line1: '27 Orchard Rise',
    town: 'Bramley Cross',
    postcode: 'BC2 3GH',
    stage: 'quoted',
    estimator: 'estimator2',
    spaces: ['Main loft'],
  },
  {
    customer: 'Rowan & Jo Achebe',
    email: 'rowan.achebe@example.com',
    phone: '01632 960104',
    line1: '9 Millpond Lane',
    town: 'Bramley Cross',
    postcode: 'BC2 5JK',
    stage: 'declined',
    estimator: 'estimator2',
    spaces: ['Main loft'],
    notes: 'Declined for now; revisit in spring.',
  },
  {
    customer: 'Bernadette Fox',
    email: 'b.fox@example.com',
    phone: '01632 960105',
    line1: '61 Chapel Street',
    town: 'Kelsworth',
    postcode: 'KW3 1LM',
    stage: 'accepted',
    estimator: 'estimator',
    spaces: ['Main loft', 'Extension'],
  },
  {
    customer: 'Samuel Okonjo',
    email: 'sam.okonjo@example.com',
    phone: '01632 960106',
    line1: '2 Heron Court',
    town: 'Kelsworth',
    postcode: 'KW3 6NP',
    stage: 'scheduled',
    installer: 'installer',
    installInDays: 45,
    estimator: 'estimator',
    spaces: ['Main loft'],
    accessNotes: 'Key with the neighbour at no. 4. Dog on site.',
  },
  {
    customer: 'Lydia Carrow',
    email: 'lydia.carrow@example.com',
    phone: '01632 960107',
    line1: '40 Beacon Hill',
    town: 'Ashcombe',
    postcode: 'AB1 7QR',
    stage: 'scheduled',
    installer: 'installer2',
    installInDays: 47,
    estimator: 'estimator2',
    spaces: ['Main loft'],
  },
  {
    customer: 'Arthur Penhaligon',
    email: 'a.penhaligon@example.com',
    phone: '01632 960108',
    line1: '5 Foundry Row',
    town: 'Kelsworth',
    postcode: 'KW3 2ST',
    stage: 'installed',
    installer: 'installer',
    installInDays: -10,
    estimator: 'estimator',
    spaces: ['Main loft'],
  },
  {
    customer: 'Fatima Rahman',
    email: 'fatima.rahman@example.com',
    phone: '01632 960109',
    line1: '18 Linden Avenue',
    town: 'Bramley Cross',
    postcode: 'BC2 8UV',
    stage: 'closed',
    installer: 'installer2',
    installInDays: -35,
    estimator: 'estimator2',
    spaces: ['Main loft'],
  },
  {
    customer: 'Colm Duggan',
    email: 'colm.duggan@example.com',
    phone: '01632 960110',
    line1: '7 Saltings Way',
    town: 'Ashcombe',
    postcode: 'AB1 9WX',
    stage: 'accepted',
    estimator: 'estimator',
    spaces: ['Main loft', 'Garage loft'],
  },
  // Finished in the months before: with the two above they give the estimate-against-actual report its history.
  ...(
    [
      ['Gwen Ashdown', 'gwen.ashdown@example.com', '2 Tanner Close', -80, 'installer', 'estimator'],
      ['Rupert Iles', 'rupert.iles@example.com', '41 Orchard Lane', -59, 'installer2', 'estimator2'],
      ['Mei Lin Oduya', 'meilin.oduya@example.com', '9 Cobble Yard', -24, 'installer', 'estimator'],
    ] as const
  ).map(([customer, email, line1, installInDays, installer, estimator], i) => ({
    customer,
    email,
    phone: `01632 96012${i}`,
    line1,
    town: 'Kelsworth',
    postcode: `KW3 ${i + 4}AA`,
    stage: 'closed' as const,
    installer,
    installInDays,
    estimator,
    spaces: ['Main loft'],
  })),
];

const OTHER_JOBS: DemoJob[] = [
  {
    customer: 'Imogen Thorne',
    email: 'imogen.thorne@example.com',
    phone: '01632 960201',
    line1: '12 Quarry Bank',
    town: 'Northgate',
    postcode: 'NG9 1AA',
    stage: 'surveyed',
    estimator: 'estimator',
    spaces: ['Main loft'],
  },
  {
    customer: 'Pádraig Walsh',
    email: 'p.walsh@example.com',
    phone: '01632 960202',
    line1: '33 Ferry Road',
    town: 'Northgate',
    postcode: 'NG9 2BB',
    stage: 'scheduled',
    installer: 'installer',
    installInDays: 49,
    estimator: 'estimator',
    spaces: ['Main loft'],
  },
];

/** Used only when examples/ holds no valid plan yet: a plain rectangular loft. */
const FALLBACK_PLAN: unknown = {
  format: 'quiltline-plan/1',
  name: 'Main loft',
  outline: [
    [0, 0],
    [8400, 0],
    [8400, 5200],
    [0, 5200],
  ],
  eavesEdges: [0, 2],
  eavesGapMm: 50,
  joists: { angleDeg: 90, centresMm: 400, widthMm: 47, depthMm: 100, offsetMm: 0 },
  exclusions: [
    {
      kind: 'hatch',
      label: 'loft hatch',
      polygon: [
        [3800, 4300],
        [4500, 4300],
        [4500, 5000],
        [3800, 5000],
      ],
    },
  ],
  existing: { depthMm: 100, condition: 'good' },
  target: { depthMm: 270 },
};

/** Every valid plan in examples/*.json, checked by validatePlan (invalid ones — some are there on purpose — are skipped). */
export function loadExamplePlans(dir = path.join(REPO_ROOT, 'examples')): Array<{ file: string; plan: Plan }> {
  if (!fs.existsSync(dir)) return [];
  const out: Array<{ file: string; plan: Plan }> = [];
  for (const file of fs
    .readdirSync(dir)
    .filter((f) => f.endsWith('.json'))
    .sort()) {
    try {
      const r = validatePlan(JSON.parse(fs.readFileSync(path.join(dir, file), 'utf8')));
      if (r.ok) out.push({ file, plan: r.plan });
    } catch {
      /* not JSON: skip */
    }
  }
  return out;
}

/** The install day `days` from `today`, moved on past a weekend (the demo's installers work weekdays; at most two days, so a past install stays past). */
function installDay(today: string, days: number): string {
  const day = addDaysIso(today, days);
  const weekday = new Date(`${day}T00:00:00Z`).getUTCDay();
  return weekday === 6 ? addDaysIso(day, 2) : weekday === 0 ? addDaysIso(day, 1) : day;
}

/** Creates one company, its users and jobs; returns when each job's history happened, by job id. */
async function seedCompany(deps: AppDeps, name: string, users: typeof DEMO_USERS, jobs: DemoJob[], plans: Plan[], passwordHash: string, now: Date) {
  const { sequelize } = deps;
  const firstPlans: { spaceId: string; authorId: string | null; plan: Plan }[] = [];
  const times = new Map<string, DemoTimes>();
  // Created in the order they came in, so references follow their enquiries as the app numbers them;
  // each keeps the plans of its place in the list.
  let planIndex = 0;
  const dated = jobs
    .map((j, i) => {
      const installDate = j.installInDays === undefined ? null : installDay(todayIso(now), j.installInDays);
      const firstPlan = planIndex;
      planIndex += j.spaces.length;
      return { j, installDate, firstPlan, at: demoTimes(demoStagePath(j.stage), installDate, i, now) };
    })
    .sort((a, b) => a.at.created!.getTime() - b.at.created!.getTime());
  const orgId = await sequelize.transaction(async (transaction) => {
    const org = await Organisation.create({ name }, { transaction });
    await createCompanyDefaults(org.id, name, transaction);
    const byKey = new Map<string, User>();
    for (const u of users) {
      byKey.set(u.key, await User.create({ organisationId: org.id, email: u.email, name: u.name, role: u.role, passwordHash }, { transaction }));
    }
    for (const { j, installDate, firstPlan, at } of dated) {
      const customer = await Customer.create(
        {
          organisationId: org.id,
          name: j.customer,
          email: j.email,
          phone: j.phone,
          addressLine1: j.line1,
          addressLine2: '',
          town: j.town,
          postcode: j.postcode,
        },
        { transaction },
      );
      const author = byKey.get(j.estimator) ?? null;
      const job = await Job.create(
        {
          organisationId: org.id,
          reference: await nextJobReference(sequelize, org.id, transaction),
          customerId: customer.id,
          addressLine1: j.line1,
          addressLine2: '',
          town: j.town,
          postcode: j.postcode,
          stage: j.stage,
          assignedInstallerId: j.installer ? byKey.get(j.installer)!.id : null,
          installDate,
          accessNotes: j.accessNotes ?? '',
          notes: j.notes ?? '',
          createdById: author?.id ?? null,
          createdAt: at.created,
        },
        { transaction },
      );
      times.set(job.id, at);
      for (const [position, spaceName] of j.spaces.entries()) {
        const space = await Space.create({ organisationId: org.id, jobId: job.id, name: spaceName, position }, { transaction });
        const plan = plans[(firstPlan + position) % plans.length];
        firstPlans.push({ spaceId: space.id, authorId: author?.id ?? null, plan: { ...plan, name: spaceName } });
      }
    }
    return org.id;
  });
  // Plans are stored like any other revision, with their takeoff: that needs the company's catalogue first.
  // The demo hatch kit's lid insulation: an invented round figure, so the demo's whole-ceiling U credits the kit its quotes add.
  await seedDemoCatalogue(orgId, { hatchKitInsulationMm: 100 });
  const inputs = await companyTakeoffInputs(orgId);
  for (const p of firstPlans) await storePlanRevision(sequelize, { organisationId: orgId, ...p, note: 'demo plan' }, { inputs });
  return times;
}

/**
 * Creates the demo companies once. Idempotent: does nothing when the demo company exists.
 * Returns true when it created them.
 */
export async function seedDemo(deps: AppDeps): Promise<boolean> {
  if (await Organisation.findOne({ where: { name: DEMO_COMPANY } })) return false;
  const examples = loadExamplePlans();
  const plans = examples.length ? examples.map((e) => e.plan) : [planSchema.parse(FALLBACK_PLAN)];
  const passwordHash = await bcrypt.hash(DEMO_PASSWORD, deps.config.bcryptRounds);
  // One clock for the whole seed: every date of the demo is placed relative to it.
  const now = new Date();
  const times = new Map([
    ...(await seedCompany(deps, DEMO_COMPANY, DEMO_USERS, DEMO_JOBS, plans, passwordHash, now)),
    ...(await seedCompany(deps, OTHER_COMPANY, OTHER_USERS, OTHER_JOBS, plans, passwordHash, now)),
  ]);
  await seedDemoDocuments(deps, [DEMO_COMPANY, OTHER_COMPANY], times);
  await seedDemoActuals(DEMO_COMPANY, times);
  await seedDemoHistory(times);
  return true;
}
