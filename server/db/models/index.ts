import type { Sequelize } from 'sequelize';
import { AuthToken } from './auth-token';
import { CompanySetting } from './company-setting';
import { Customer } from './customer';
import { Extra } from './extra';
import { IdempotencyKey } from './idempotency-key';
import { InstallSetting } from './install-setting';
import { Invoice } from './invoice';
import { InvoiceCounter } from './invoice-counter';
import { InvoiceLine } from './invoice-line';
import { Job } from './job';
import { JobActual } from './job-actual';
import { JobCompletion } from './job-completion';
import { JobEvent } from './job-event';
import { JobNote } from './job-note';
import { JobPhoto } from './job-photo';
import { JobTick } from './job-tick';
import { MailMessage } from './mail-message';
import { Organisation } from './organisation';
import { Payment } from './payment';
import { PaymentEvent } from './payment-event';
import { PaymentSetting } from './payment-setting';
import { PlanRevision } from './plan-revision';
import { Product } from './product';
import { Quote } from './quote';
import { QuoteLine } from './quote-line';
import { SettingsChange } from './settings-change';
import { Space } from './space';
import { TaxRate } from './tax-rate';
import { User } from './user';

export type { AuthTokenPurpose } from './auth-token';
export type { MailStatus } from './mail-message';
export {
  AuthToken,
  CompanySetting,
  Customer,
  Extra,
  IdempotencyKey,
  InstallSetting,
  Invoice,
  InvoiceCounter,
  InvoiceLine,
  Job,
  JobActual,
  JobCompletion,
  JobEvent,
  JobNote,
  JobPhoto,
  JobTick,
  MailMessage,
  Organisation,
  Payment,
  PaymentEvent,
  PaymentSetting,
  PlanRevision,
  Product,
  Quote,
  QuoteLine,
  SettingsChange,
  Space,
  TaxRate,
  User,
};

/** Every model, one per file in this folder, grouped by domain. */
const MODELS = {
  company: [Organisation, User, AuthToken, CompanySetting, SettingsChange, Product, Extra, TaxRate],
  jobs: [Customer, Job, JobEvent, Space, PlanRevision, MailMessage],
  quotes: [Quote, QuoteLine],
  siteWork: [InstallSetting, JobTick, JobNote, JobPhoto, JobCompletion, JobActual, IdempotencyKey],
  money: [PaymentSetting, Payment, PaymentEvent, InvoiceCounter, Invoice, InvoiceLine],
} as const;

const org = { foreignKey: { name: 'organisationId', allowNull: false } } as const;

function associateCompany() {
  Organisation.hasMany(User, org);
  User.belongsTo(Organisation, { as: 'organisation', ...org });
  AuthToken.belongsTo(Organisation, org);
  AuthToken.belongsTo(User, { as: 'user', foreignKey: { name: 'userId', allowNull: false } });
  for (const M of [CompanySetting, Product, Extra, TaxRate] as const) (M as typeof Product).belongsTo(Organisation, org);
}

function associateJobs() {
  for (const M of [Customer, Job, Space, PlanRevision, JobEvent] as const) (M as typeof Job).belongsTo(Organisation, org);
  Job.belongsTo(Customer, { as: 'customer', foreignKey: { name: 'customerId', allowNull: false } });
  Customer.hasMany(Job, { as: 'jobs', foreignKey: 'customerId' });
  Job.belongsTo(User, { as: 'assignedInstaller', foreignKey: 'assignedInstallerId' });
  Job.belongsTo(User, { as: 'createdBy', foreignKey: 'createdById' });
  Job.hasMany(Space, { as: 'spaces', foreignKey: { name: 'jobId', allowNull: false } });
  Space.belongsTo(Job, { as: 'job', foreignKey: { name: 'jobId', allowNull: false } });
  Space.hasMany(PlanRevision, { as: 'revisions', foreignKey: { name: 'spaceId', allowNull: false } });
  PlanRevision.belongsTo(Space, { as: 'space', foreignKey: { name: 'spaceId', allowNull: false } });
  PlanRevision.belongsTo(User, { as: 'author', foreignKey: 'authorId' });
  Job.hasMany(JobEvent, { as: 'events', foreignKey: { name: 'jobId', allowNull: false } });
  JobEvent.belongsTo(Job, { as: 'job', foreignKey: { name: 'jobId', allowNull: false } });
  JobEvent.belongsTo(User, { as: 'user', foreignKey: 'userId' });
}

function associateQuotes() {
  Quote.belongsTo(Organisation, org);
  QuoteLine.belongsTo(Organisation, org);
  Quote.belongsTo(Job, { as: 'job', foreignKey: { name: 'jobId', allowNull: false } });
  Quote.belongsTo(User, { as: 'createdBy', foreignKey: 'createdById' });
  Quote.hasMany(QuoteLine, { as: 'lines', foreignKey: { name: 'quoteId', allowNull: false } });
  QuoteLine.belongsTo(Quote, { as: 'quote', foreignKey: { name: 'quoteId', allowNull: false } });
}

function associateSiteWork() {
  for (const M of [JobTick, JobNote, JobPhoto, JobCompletion] as const) {
    (M as typeof JobTick).belongsTo(User, { as: 'user', foreignKey: 'userId' });
  }
  JobActual.belongsTo(User, { as: 'recordedBy', foreignKey: 'recordedById' });
  JobActual.belongsTo(User, { as: 'editedBy', foreignKey: 'editedById' });
  SettingsChange.belongsTo(User, { as: 'user', foreignKey: 'userId' });
  JobTick.belongsTo(Job, { as: 'job', foreignKey: 'jobId' });
  JobPhoto.belongsTo(Space, { as: 'space', foreignKey: 'spaceId' });
}

function associateMoney() {
  Invoice.hasMany(InvoiceLine, { as: 'lines', foreignKey: 'invoiceId' });
  InvoiceLine.belongsTo(Invoice, { as: 'invoice', foreignKey: 'invoiceId' });
}

/** Initialises every model on this Sequelize instance, then their associations. */
export function initModels(sequelize: Sequelize): void {
  for (const group of Object.values(MODELS)) for (const M of group) (M as unknown as { initModel(s: Sequelize): void }).initModel(sequelize);
  associateCompany();
  associateJobs();
  associateQuotes();
  associateSiteWork();
  associateMoney();
}
