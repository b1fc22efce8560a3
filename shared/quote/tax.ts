import type { TaxClass } from '../api/settings';

/** A dated tax rate: `rateBp` basis points for `taxClass` from `validFrom` (ISO date, inclusive). */
export interface DatedTaxRate {
  taxClass: TaxClass;
  rateBp: number;
  validFrom: string;
  label?: string;
}

/**
 * The rate in force for a class on a date (ISO yyyy-mm-dd): the entry with the latest `validFrom`
 * on or before the date. Throws when no rate covers the date, so a quote never silently goes untaxed.
 */
export function taxRateOn(rates: readonly DatedTaxRate[], taxClass: TaxClass, dateIso: string): DatedTaxRate {
  let best: DatedTaxRate | undefined;
  for (const r of rates) {
    if (r.taxClass !== taxClass || r.validFrom > dateIso) continue;
    if (!best || r.validFrom > best.validFrom) best = r;
  }
  if (!best) throw new Error(`no ${taxClass.replace('_', '-')} tax rate applies on ${dateIso}: add one in Settings → Tax`);
  return best;
}

/**
 * UK VAT for loft insulation in homes, as a starting point for a UK company (HMRC VAT Notice 708/6):
 * installing energy-saving materials is zero-rated from 1 May 2023 to 31 March 2027, then 5%;
 * other items on the job are standard-rated at 20% (since 4 January 2011). The 5% entry from
 * 2019-10-01 stands for the reduced rate that applied (with conditions) before the zero rate: from
 * memory, kept only so older quotes price sensibly; the standard rate's start date is from memory too.
 */
export const UK_DEFAULT_TAX_RATES: readonly DatedTaxRate[] = [
  { taxClass: 'energy_saving', rateBp: 500, validFrom: '2019-10-01', label: 'Reduced rate, energy-saving materials' },
  { taxClass: 'energy_saving', rateBp: 0, validFrom: '2023-05-01', label: 'Zero rate, installed energy-saving materials' },
  { taxClass: 'energy_saving', rateBp: 500, validFrom: '2027-04-01', label: 'Reduced rate, installed energy-saving materials' },
  { taxClass: 'standard', rateBp: 2000, validFrom: '2011-01-04', label: 'Standard rate' },
];

/** "20%", "5%", "0%", "12.5%" from basis points. */
export function formatRateBp(rateBp: number): string {
  return `${(rateBp / 100).toFixed(2).replace(/\.?0+$/, '')}%`;
}
