import type { Sequelize } from 'sequelize';
import { Invoice } from './invoice';
import { InvoiceCounter } from './invoice-counter';
import { InvoiceLine } from './invoice-line';
import { Payment } from './payment';
import { PaymentEvent } from './payment-event';
import { PaymentSetting } from './payment-setting';

/** The payments/invoices models and their associations, appended to MODEL_REGISTRY in index.ts. */
export const PAYMENTS_MODELS: Array<{ init: (s: Sequelize) => void; associate?: () => void }> = [
  { init: (s) => PaymentSetting.initModel(s) },
  { init: (s) => Payment.initModel(s) },
  { init: (s) => PaymentEvent.initModel(s) },
  { init: (s) => InvoiceCounter.initModel(s) },
  { init: (s) => Invoice.initModel(s) },
  { init: (s) => InvoiceLine.initModel(s) },
  {
    init: () => undefined,
    associate: () => {
      Invoice.hasMany(InvoiceLine, { as: 'lines', foreignKey: 'invoiceId' });
      InvoiceLine.belongsTo(Invoice, { as: 'invoice', foreignKey: 'invoiceId' });
    },
  },
];
