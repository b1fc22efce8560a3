import { useMemo } from 'react';
import { FormProvider } from 'react-hook-form';
import { z } from 'zod';
import { depositModeSchema, paymentSettingsBodySchema, type DepositMode, type PaymentSettings } from '../../../../shared/api/payments';
import { formatMoneyInput, readMoney } from '../../../../shared/quote/money-input';
import { Alert, Button, Card, ErrorState, Input, LoadingState, PageHeader } from '../../../components/ui';
import { FormField, showServerErrors, useZodForm } from '../../../lib/forms';
import { asSentence } from '../../../lib/form-errors';
import { usePaymentSettings, useUpdatePaymentSettings } from '../api/payment-settings';

const MODES: Array<{ value: DepositMode; label: string }> = [
  { value: 'none', label: 'No deposit' },
  { value: 'percent', label: 'A percentage of the quote' },
  { value: 'fixed', label: 'A fixed amount' },
];

/**
 * The page's text → the API's body, then paymentSettingsBodySchema itself: the percentage typed is
 * basis points, the amount goes through readMoney, and only the field the mode uses is sent.
 */
const paymentFormSchema = (currency: string) =>
  z
    .object({ depositMode: depositModeSchema, depositPercentBp: z.string(), depositFixedMinor: z.string(), paymentTermsDays: z.string() })
    .transform((v, ctx): z.input<typeof paymentSettingsBodySchema> => {
      let fixed: number | null = null;
      if (v.depositMode === 'fixed' && v.depositFixedMinor.trim() !== '') {
        const r = readMoney(v.depositFixedMinor, currency);
        if (!r.ok) {
          ctx.addIssue({ code: 'custom', path: ['depositFixedMinor'], message: r.message });
          return z.NEVER;
        }
        fixed = r.minor;
      }
      const percent = v.depositPercentBp.trim() === '' ? null : Math.round(Number(v.depositPercentBp) * 100);
      return {
        depositMode: v.depositMode,
        depositPercentBp: v.depositMode === 'percent' ? percent : null,
        depositFixedMinor: fixed,
        paymentTermsDays: v.paymentTermsDays.trim() === '' ? Number.NaN : Number(v.paymentTermsDays),
      };
    })
    .pipe(paymentSettingsBodySchema);

const formValues = (s: PaymentSettings) => ({
  depositMode: s.depositMode,
  depositPercentBp: s.depositPercentBp ? String(s.depositPercentBp / 100) : '',
  depositFixedMinor: s.depositFixedMinor ? formatMoneyInput(s.depositFixedMinor, s.currency) : '',
  paymentTermsDays: String(s.paymentTermsDays),
});

/** Office: the deposit asked when a customer accepts, and the payment terms of invoices. */
export default function PaymentSettingsPage() {
  const settings = usePaymentSettings();
  if (settings.isPending) return <LoadingState label="Loading payment settings…" />;
  if (settings.isError) return <ErrorState error={settings.error} onRetry={() => settings.refetch()} />;
  return <PaymentSettingsForm settings={settings.data.settings} provider={settings.data.provider} />;
}

function PaymentSettingsForm({ settings, provider }: { settings: PaymentSettings; provider: 'service' | 'local' | 'off' }) {
  const save = useUpdatePaymentSettings();
  const { currency } = settings;
  // Settings from the server (after a save) fill the form again.
  const values = useMemo(() => formValues(settings), [settings]);
  const form = useZodForm(paymentFormSchema(currency), { values });
  const mode = form.watch('depositMode');
  const onSubmit = form.handleSubmit(async (body) => {
    try {
      await save.mutateAsync(body);
    } catch (err) {
      showServerErrors(err, form.setError);
    }
  });
  const problem = form.formState.errors.root?.server?.message;
  return (
    <div className="max-w-2xl">
      <PageHeader eyebrow="Settings" title="Deposits and invoices" />
      <Card>
        <FormProvider {...form}>
          <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
            <fieldset className="flex flex-col gap-1.5">
              <legend className="mb-1 text-sm font-medium">When a customer accepts a quote, ask for</legend>
              {MODES.map((m) => (
                <label key={m.value} className="flex items-center gap-2 text-sm">
                  <input type="radio" value={m.value} {...form.register('depositMode')} /> {m.label}
                </label>
              ))}
            </fieldset>
            {mode === 'percent' && (
              <FormField name="depositPercentBp" label="Deposit, % of the quote total">
                <Input inputMode="decimal" className="w-32" {...form.register('depositPercentBp')} />
              </FormField>
            )}
            {mode === 'fixed' && (
              <FormField name="depositFixedMinor" label={`Deposit amount (${currency})`} hint="Never more than the quote's total.">
                <Input inputMode="decimal" className="w-40" {...form.register('depositFixedMinor')} />
              </FormField>
            )}
            <FormField name="paymentTermsDays" label="Invoices are due after (days)">
              <Input type="number" min={0} max={365} className="w-28" {...form.register('paymentTermsDays')} />
            </FormField>
            {problem && <Alert>{asSentence(problem)}</Alert>}
            {save.isSuccess && <Alert tone="success">Saved.</Alert>}
            <div>
              <Button type="submit" busy={save.isPending}>
                Save
              </Button>
            </div>
          </form>
        </FormProvider>
      </Card>
      <p className="mt-4 text-sm text-graphite-light">
        {provider === 'service'
          ? 'Card payments go through the payment service with the keys set on the server.'
          : provider === 'local'
            ? 'No payment keys are set on the server: card payments use the local test checkout, and no money moves. Set STRIPE_SECRET_KEY and STRIPE_WEBHOOK_SECRET to take real payments.'
            : 'Card payments are switched off on this server (no payment keys set).'}
      </p>
    </div>
  );
}
