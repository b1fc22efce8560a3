import type { PaymentSettings } from '../../../shared/api/payments';
import { PaymentSetting } from '../../db/models/payment-setting';
import { loadCompanySettings } from './settings.service';

/** A company's deposit and payment terms; defaults (no deposit, 14 days) when it set none. Reads only. */
export async function loadPaymentSettings(organisationId: string): Promise<PaymentSettings> {
  const row = await PaymentSetting.findByPk(organisationId);
  const company = await loadCompanySettings(organisationId);
  return {
    depositMode: row?.depositMode ?? 'none',
    depositPercentBp: row?.depositPercentBp ?? null,
    depositFixedMinor: row?.depositFixedMinor ?? null,
    paymentTermsDays: row?.paymentTermsDays ?? 14,
    currency: company.currency,
  };
}
