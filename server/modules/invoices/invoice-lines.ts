import type { Transaction } from 'sequelize';
import type { InvoiceLineInput } from '../../../shared/api/invoices';
import { taxRateOn, type DatedTaxRate } from '../../../shared/quote/tax';
import type { Invoice } from '../../db/models/invoice';
import { InvoiceLine } from '../../db/models/invoice-line';
import { TaxRate } from '../../db/models/tax-rate';
import { ValidationError } from '../../lib/errors';
import { ensureCompanySettings } from '../settings/settings.service';
import { lineAmounts } from './invoice-totals';

export interface LineRow {
  source: 'quote' | 'variation' | 'credit';
  description: string;
  quantity: number;
  unit: string;
  unitPriceMinor: number;
  taxClass: string | null;
  rateBp: number;
  netMinor: number;
  taxMinor: number;
}

export async function ratesOf(organisationId: string): Promise<DatedTaxRate[]> {
  await ensureCompanySettings(organisationId); // a company's first invoice gives it the default rates (a write path)
  const rows = await TaxRate.findAll({ where: { organisationId } });
  return rows.map((r) => ({ taxClass: r.taxClass, rateBp: r.rateBp, validFrom: r.validFrom }));
}

/** Price lines the office typed, with the company's rate for each tax class on the document's date. */
export function priceInputs(
  inputs: readonly InvoiceLineInput[],
  source: 'variation' | 'credit',
  rates: DatedTaxRate[],
  dateIso: string,
  pathPrefix: string,
): LineRow[] {
  return inputs.map((l, i) => {
    let rateBp: number;
    try {
      rateBp = taxRateOn(rates, l.taxClass, dateIso).rateBp;
    } catch (e) {
      throw new ValidationError([{ path: `${pathPrefix}.${i}.taxClass`, message: e instanceof Error ? e.message : 'no tax rate' }]);
    }
    const a = lineAmounts({ quantity: l.quantity, unitPriceMinor: l.unitPriceMinor, rateBp });
    return {
      source,
      description: l.description,
      quantity: l.quantity,
      unit: l.unit ?? 'each',
      unitPriceMinor: l.unitPriceMinor,
      taxClass: l.taxClass,
      rateBp,
      netMinor: a.netMinor,
      taxMinor: a.taxMinor,
    };
  });
}

export async function insertLines(inv: Invoice, rows: LineRow[], t: Transaction) {
  await InvoiceLine.bulkCreate(
    rows.map((r, i) => ({ ...r, organisationId: inv.organisationId, invoiceId: inv.id, position: i + 1 })),
    { transaction: t },
  );
}
