import type { Sequelize } from 'sequelize';
import { AuthToken } from './auth-token';
import { Customer } from './customer';
import { Job } from './job';
import { JobEvent } from './job-event';
import { Organisation } from './organisation';
import { PAYMENTS_MODELS } from './payments-registry';
import { PlanRevision } from './plan-revision';
import { QUOTES_SETTINGS_MODELS } from './quotes-settings-registry';
import { Space } from './space';
import { INSTALLER_MODELS } from './installer-registry';
import { User } from './user';

export type { AuthTokenPurpose } from './auth-token';
export { AuthToken, Customer, Job, JobEvent, Organisation, PlanRevision, Space, User };

/**
 * Model registry. Other modules append a `{ init, associate? }` entry for each model they add
 * (one model per file in this folder).
 */
export const MODEL_REGISTRY: Array<{ init: (s: Sequelize) => void; associate?: () => void }> = [
  { init: (s) => Organisation.initModel(s) },
  { init: (s) => User.initModel(s) },
  { init: (s) => Customer.initModel(s) },
  { init: (s) => Job.initModel(s) },
  { init: (s) => Space.initModel(s) },
  { init: (s) => PlanRevision.initModel(s) },
  { init: (s) => AuthToken.initModel(s) },
  { init: (s) => JobEvent.initModel(s) },
  { init: () => undefined, associate: associateFoundation },
  // feature models: append below
  ...QUOTES_SETTINGS_MODELS, // quotes engineer: company settings, catalogue, tax rates, quotes
  ...INSTALLER_MODELS, // installer engineer: install settings, ticks, notes, photos, completions, idempotency keys
  ...PAYMENTS_MODELS, // payments engineer: payment settings, payments, webhook events, invoices
];

function associateFoundation() {
  const org = { foreignKey: { name: 'organisationId', allowNull: false } } as const;
  Organisation.hasMany(User, org);
  User.belongsTo(Organisation, { as: 'organisation', ...org });
  Customer.belongsTo(Organisation, org);
  Job.belongsTo(Organisation, org);
  Space.belongsTo(Organisation, org);
  PlanRevision.belongsTo(Organisation, org);
  AuthToken.belongsTo(Organisation, org);
  JobEvent.belongsTo(Organisation, org);

  Job.belongsTo(Customer, { as: 'customer', foreignKey: { name: 'customerId', allowNull: false } });
  Customer.hasMany(Job, { as: 'jobs', foreignKey: 'customerId' });
  Job.belongsTo(User, { as: 'assignedInstaller', foreignKey: 'assignedInstallerId' });
  Job.belongsTo(User, { as: 'createdBy', foreignKey: 'createdById' });
  Job.hasMany(Space, { as: 'spaces', foreignKey: { name: 'jobId', allowNull: false } });
  Space.belongsTo(Job, { as: 'job', foreignKey: { name: 'jobId', allowNull: false } });
  Space.hasMany(PlanRevision, { as: 'revisions', foreignKey: { name: 'spaceId', allowNull: false } });
  PlanRevision.belongsTo(Space, { as: 'space', foreignKey: { name: 'spaceId', allowNull: false } });
  PlanRevision.belongsTo(User, { as: 'author', foreignKey: 'authorId' });
  AuthToken.belongsTo(User, { as: 'user', foreignKey: { name: 'userId', allowNull: false } });
  Job.hasMany(JobEvent, { as: 'events', foreignKey: { name: 'jobId', allowNull: false } });
  JobEvent.belongsTo(Job, { as: 'job', foreignKey: { name: 'jobId', allowNull: false } });
  JobEvent.belongsTo(User, { as: 'user', foreignKey: 'userId' });
}

/** Initialises every model on this Sequelize instance, then their associations. */
export function initModels(sequelize: Sequelize): void {
  for (const m of MODEL_REGISTRY) m.init(sequelize);
  for (const m of MODEL_REGISTRY) m.associate?.();
}
