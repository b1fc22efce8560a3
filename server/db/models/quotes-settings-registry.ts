import type { Sequelize } from 'sequelize';
import { CompanySetting } from './company-setting';
import { Extra } from './extra';
import { Job } from './job';
import { Organisation } from './organisation';
import { Product } from './product';
import { Quote } from './quote';
import { QuoteLine } from './quote-line';
import { TaxRate } from './tax-rate';
import { User } from './user';

/** The quotes/settings models and their associations, appended to MODEL_REGISTRY in index.ts. */
export const QUOTES_SETTINGS_MODELS: Array<{ init: (s: Sequelize) => void; associate?: () => void }> = [
  { init: (s) => CompanySetting.initModel(s) },
  { init: (s) => Product.initModel(s) },
  { init: (s) => Extra.initModel(s) },
  { init: (s) => TaxRate.initModel(s) },
  { init: (s) => Quote.initModel(s) },
  { init: (s) => QuoteLine.initModel(s) },
  {
    init: () => undefined,
    associate: () => {
      const org = { foreignKey: { name: 'organisationId', allowNull: false } } as const;
      CompanySetting.belongsTo(Organisation, org);
      Product.belongsTo(Organisation, org);
      Extra.belongsTo(Organisation, org);
      TaxRate.belongsTo(Organisation, org);
      Quote.belongsTo(Organisation, org);
      QuoteLine.belongsTo(Organisation, org);
      Quote.belongsTo(Job, { as: 'job', foreignKey: { name: 'jobId', allowNull: false } });
      Quote.belongsTo(User, { as: 'createdBy', foreignKey: 'createdById' });
      Quote.hasMany(QuoteLine, { as: 'lines', foreignKey: { name: 'quoteId', allowNull: false } });
      QuoteLine.belongsTo(Quote, { as: 'quote', foreignKey: { name: 'quoteId', allowNull: false } });
    },
  },
];
