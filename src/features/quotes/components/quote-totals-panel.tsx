import type { DepositTerms } from '../../../../shared/quote/deposit';
import { applyRateBp, formatMoney } from '../../../../shared/quote/money';
import { formatRateBp } from '../../../../shared/quote/tax';
import { ROUNDING_NOTE, type QuoteTotals } from '../../../../shared/quote/totals';
import { paybackYears } from '../../../../shared/takeoff/savings';
import { Card, CardTitle } from '../../../components/ui';

type Props = {
  totals: QuoteTotals | null;
  currency: string;
  locale: string;
  saving: { kwhPerYear: number; minorPerYear: number } | null;
  siteHours: number;
  showMargin: boolean;
  /** The deposit the customer is asked on acceptance (company settings), null when none. */
  deposit: DepositTerms | null;
};

/** Totals before tax, tax by rate, total, margin against cost, and the saving with its payback. */
export function QuoteTotalsPanel({ totals, currency, locale, saving, siteHours, showMargin, deposit }: Props) {
  const m = (x: number) => formatMoney(x, currency, locale);
  if (!totals) return <Card>Fix the lines marked in red to see the totals.</Card>;
  const payback = saving ? paybackYears(totals.grossMinor, saving.minorPerYear) : null;
  const row = (label: string, value: string, strong = false, testId?: string) => (
    <div key={label} className={`flex justify-between gap-4 py-1 ${strong ? 'border-t border-graphite/30 pt-2 font-semibold' : ''}`}>
      <dt>{label}</dt>
      <dd className="font-mono" data-testid={testId}>
        {value}
      </dd>
    </div>
  );
  return (
    <Card>
      <CardTitle>Totals</CardTitle>
      <dl className="text-sm">
        {row('Before tax', m(totals.netMinor), false, 'total-net')}
        {totals.taxByRate.map((b) => row(`Tax at ${formatRateBp(b.rateBp)} on ${m(b.netMinor)}`, m(b.taxMinor)))}
        {row('Total', m(totals.grossMinor), true, 'total-gross')}
        {deposit &&
          row(
            `Deposit on acceptance${deposit.percentBp ? ` (${deposit.percentBp / 100}%)` : ''}`,
            // A percentage follows the lines being edited; a fixed amount is capped at the total.
            m(deposit.percentBp ? applyRateBp(totals.grossMinor, deposit.percentBp) : Math.min(deposit.amountMinor, totals.grossMinor)),
            false,
            'total-deposit',
          )}
        {showMargin && (
          <>
            {row('Cost', m(totals.costMinor))}
            {row(`Margin (${(totals.marginBp / 100).toFixed(1)}%)`, m(totals.marginMinor), false, 'total-margin')}
          </>
        )}
      </dl>
      <p className="mt-2 text-xs text-graphite-light">{ROUNDING_NOTE}</p>
      {siteHours > 0 && <p className="mt-2 text-sm">About {siteHours} h on site.</p>}
      {saving && saving.minorPerYear > 0 && (
        <p className="mt-2 text-sm" data-testid="saving">
          Saves about {Math.round(saving.kwhPerYear).toLocaleString(locale)} kWh, {m(saving.minorPerYear)} a year
          {payback !== null && <>; pays back in about {payback} years</>}.
        </p>
      )}
    </Card>
  );
}
