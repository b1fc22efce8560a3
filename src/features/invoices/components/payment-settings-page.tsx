import { useState, type FormEvent } from 'react';
import type { DepositMode } from '../../../../shared/api/payments';
import { minorToDecimalString } from '../../../../shared/quote/money';
import { readMoney } from '../../../../shared/quote/money-input';
import { Alert, Button, Card, ErrorState, Field, Input, LoadingState, PageHeader } from '../../../components/ui';
import { asSentence, serverFieldErrors } from '../../../lib/form-errors';
import { usePaymentSettings, useUpdatePaymentSettings } from '../api/payment-settings';

const MODES: Array<{ value: DepositMode; label: string }> = [
  { value: 'none', label: 'No deposit' },
  { value: 'percent', label: 'A percentage of the quote' },
  { value: 'fixed', label: 'A fixed amount' },
];

/** Office: the deposit asked when a customer accepts, and the payment terms of invoices. */
export default function PaymentSettingsPage() {
  const settings = usePaymentSettings();
  const save = useUpdatePaymentSettings();
  const [mode, setMode] = useState<DepositMode>('none');
  const [percent, setPercent] = useState('');
  const [fixed, setFixed] = useState('');
  const [terms, setTerms] = useState('14');
  const [problem, setProblem] = useState<string | null>(null);
  // Settings from the server fill the form (adjusted during render, not in an effect).
  const [shown, setShown] = useState<typeof settings.data>(undefined);
  if (settings.data !== shown) {
    setShown(settings.data);
    if (settings.data) {
      const s = settings.data.settings;
      setMode(s.depositMode);
      setPercent(s.depositPercentBp ? String(s.depositPercentBp / 100) : '');
      setFixed(s.depositFixedMinor ? minorToDecimalString(s.depositFixedMinor, s.currency) : '');
      setTerms(String(s.paymentTermsDays));
    }
  }
  if (settings.isPending) return <LoadingState label="Loading payment settings…" />;
  if (settings.isError) return <ErrorState error={settings.error} onRetry={() => settings.refetch()} />;
  const { currency } = settings.data.settings;

  function submit(e: FormEvent) {
    e.preventDefault();
    const bp = Math.round(Number(percent) * 100);
    const fixedReading = readMoney(fixed, currency);
    const fixedMinor = fixedReading.ok ? fixedReading.minor : null;
    if (mode === 'percent' && !(bp >= 1 && bp <= 10000)) return setProblem('enter a percentage between 0.01 and 100');
    if (mode === 'fixed' && !fixedReading.ok) return setProblem(`fixed deposit: ${fixedReading.message}`);
    if (mode === 'fixed' && !(fixedMinor && fixedMinor > 0)) return setProblem('fixed deposit: enter an amount above 0');
    setProblem(null);
    save.mutate({
      depositMode: mode,
      depositPercentBp: mode === 'percent' ? bp : null,
      depositFixedMinor: mode === 'fixed' ? fixedMinor : null,
      paymentTermsDays: Number(terms),
    });
  }
  const fieldErrors = serverFieldErrors(save.error);
  return (
    <div className="max-w-2xl">
      <PageHeader eyebrow="Settings" title="Deposits and invoices" />
      <Card>
        <form onSubmit={submit} className="flex flex-col gap-4">
          <fieldset className="flex flex-col gap-1.5">
            <legend className="mb-1 text-sm font-medium">When a customer accepts a quote, ask for</legend>
            {MODES.map((m) => (
              <label key={m.value} className="flex items-center gap-2 text-sm">
                <input type="radio" name="depositMode" value={m.value} checked={mode === m.value} onChange={() => setMode(m.value)} /> {m.label}
              </label>
            ))}
          </fieldset>
          {mode === 'percent' && (
            <Field label="Deposit, % of the quote total" error={fieldErrors.depositPercentBp}>
              <Input inputMode="decimal" className="w-32" value={percent} onChange={(e) => setPercent(e.target.value)} />
            </Field>
          )}
          {mode === 'fixed' && (
            <Field label={`Deposit amount (${currency})`} hint="Never more than the quote's total." error={fieldErrors.depositFixedMinor}>
              <Input inputMode="decimal" className="w-40" value={fixed} onChange={(e) => setFixed(e.target.value)} />
            </Field>
          )}
          <Field label="Invoices are due after (days)" error={fieldErrors.paymentTermsDays}>
            <Input type="number" min={0} max={365} className="w-28" value={terms} onChange={(e) => setTerms(e.target.value)} />
          </Field>
          {(problem || (save.isError && Object.keys(fieldErrors).length === 0)) && <Alert>{asSentence(problem ?? save.error?.message ?? '')}</Alert>}
          {save.isSuccess && <Alert tone="success">Saved.</Alert>}
          <div>
            <Button type="submit" busy={save.isPending}>
              Save
            </Button>
          </div>
        </form>
      </Card>
      <p className="mt-4 text-sm text-graphite-light">
        {settings.data.provider === 'service'
          ? 'Card payments go through the payment service with the keys set on the server.'
          : settings.data.provider === 'local'
            ? 'No payment keys are set on the server: card payments use the local test checkout, and no money moves. Set STRIPE_SECRET_KEY and STRIPE_WEBHOOK_SECRET to take real payments.'
            : 'Card payments are switched off on this server (no payment keys set).'}
      </p>
    </div>
  );
}
