import { useState } from 'react';
import { useParams } from 'react-router-dom';
import type { PublicQuote } from '../../../../shared/api/quotes';
import { depositSentence } from '../../../../shared/quote/deposit';
import { formatMoney } from '../../../../shared/quote/money';
import { formatRateBp } from '../../../../shared/quote/tax';
import {
  Alert,
  Button,
  Card,
  CardTitle,
  Field,
  Input,
  LoadingState,
  Table,
  Tabs,
  TBody,
  Td,
  Th,
  THead,
  Tr,
  Textarea,
  formatDate,
} from '../../../components/ui';
import { isApiError } from '../../../lib/api-client';
import { publicQuotePdfUrl, useAnswerQuote, usePublicQuote } from '../api/public-quote';
import { DepositAfterAccept } from '../../invoices';

/** What the customer sees through the private link: the quote, then accept (typed name + terms) or decline. */
export default function PublicQuotePage() {
  const { token = '' } = useParams();
  const quote = usePublicQuote(token);
  if (quote.isPending)
    return (
      <Shell>
        <LoadingState label="Opening your quote…" />
      </Shell>
    );
  if (quote.isError) {
    const e = quote.error;
    const code = isApiError(e) ? e.code : '';
    const title =
      code === 'link_expired'
        ? 'This quote has expired'
        : code === 'link_replaced'
          ? 'There is a newer version of this quote'
          : code === 'link_invalid'
            ? 'This link does not work'
            : 'The quote could not be opened';
    return (
      <Shell>
        <Card role="alert" data-testid="link-problem">
          <h1 className="text-xl font-semibold text-graphite">{title}</h1>
          <p className="mt-2 text-graphite">{e.message}</p>
          <p className="mt-2 text-sm text-graphite-light">Nothing has been changed.</p>
        </Card>
      </Shell>
    );
  }
  return (
    <Shell>
      <QuoteView quote={quote.data} token={token} />
    </Shell>
  );
}

function Shell({ children }: { children: React.ReactNode }) {
  return <main className="mx-auto flex min-h-screen max-w-3xl flex-col gap-4 px-4 py-8">{children}</main>;
}

function QuoteView({ quote: q, token }: { quote: PublicQuote; token: string }) {
  const m = (x: number) => formatMoney(x, q.currency, q.locale);
  return (
    <>
      <header className="flex flex-col gap-1">
        <div className="font-mono text-xs uppercase tracking-wider text-timber">
          Quote {q.number}
          {q.version > 1 ? ` v${q.version}` : ''} · valid until {formatDate(q.validUntil)}
        </div>
        <h1 className="text-2xl font-semibold text-graphite">{q.company.name}</h1>
        <p className="text-sm text-graphite-light">
          For {q.customerName} · {q.propertyAddress}
        </p>
      </header>
      <Card>
        <CardTitle
          action={
            <a className="text-sm text-teal-dark underline" href={publicQuotePdfUrl(token)} target="_blank" rel="noreferrer">
              Download the PDF
            </a>
          }
        >
          What we will do
        </CardTitle>
        <Table>
          <THead>
            <Tr>
              <Th>Item</Th>
              <Th className="text-right">Qty</Th>
              <Th className="text-right">VAT</Th>
              <Th className="text-right">Amount</Th>
            </Tr>
          </THead>
          <TBody>
            {q.lines.map((l, i) => (
              <Tr key={i}>
                <Td>{l.description}</Td>
                <Td className="text-right font-mono">
                  {l.quantity} {l.unit}
                </Td>
                <Td className="text-right font-mono">{formatRateBp(l.rateBp)}</Td>
                <Td className="text-right font-mono">{m(l.netMinor)}</Td>
              </Tr>
            ))}
          </TBody>
        </Table>
        <dl className="ml-auto mt-3 max-w-sm text-sm">
          <div className="flex justify-between">
            <dt>Before VAT</dt>
            <dd className="font-mono">{m(q.totals.netMinor)}</dd>
          </div>
          {q.totals.taxByRate.map((b) => (
            <div key={b.rateBp} className="flex justify-between">
              <dt>VAT at {formatRateBp(b.rateBp)}</dt>
              <dd className="font-mono">{m(b.taxMinor)}</dd>
            </div>
          ))}
          <div className="mt-1 flex justify-between border-t border-graphite/30 pt-1 font-semibold">
            <dt>Total</dt>
            <dd className="font-mono" data-testid="public-total">
              {m(q.totals.grossMinor)}
            </dd>
          </div>
        </dl>
        {q.saving && q.saving.minorPerYear > 0 && (
          <p className="mt-3 text-sm">
            Estimated saving: about {m(q.saving.minorPerYear)} a year
            {q.saving.paybackYears !== null ? `, paying for itself in about ${q.saving.paybackYears} years` : ''}.
          </p>
        )}
      </Card>
      <Card>
        <CardTitle>Safety and what to expect</CardTitle>
        <ul className="list-disc pl-5 text-sm">
          {q.cautions.map((c) => (
            <li key={c}>{c}</li>
          ))}
        </ul>
        <h3 className="mt-3 font-semibold">Before we come, please</h3>
        <ul className="list-disc pl-5 text-sm">
          {q.customerBeforeInstall.map((c) => (
            <li key={c}>{c}</li>
          ))}
        </ul>
      </Card>
      {q.terms && (
        <Card>
          <CardTitle>Terms</CardTitle>
          <ul className="list-disc pl-5 text-sm">
            {q.terms
              .split(/\n+/)
              .filter(Boolean)
              .map((t) => (
                <li key={t}>{t}</li>
              ))}
          </ul>
        </Card>
      )}
      <Answer quote={q} token={token} />
    </>
  );
}

function Answer({ quote: q, token }: { quote: PublicQuote; token: string }) {
  const answer = useAnswerQuote(token);
  const [name, setName] = useState('');
  const [agree, setAgree] = useState(false);
  const [reason, setReason] = useState('');
  const [mode, setMode] = useState<'accept' | 'decline'>('accept');
  const [problem, setProblem] = useState<string | null>(null);
  if (q.status === 'accepted') {
    return (
      <>
        <Alert tone="success">
          Thank you: {q.acceptedName} accepted this quote{q.acceptedAt ? ` on ${formatDate(q.acceptedAt)}` : ''}. We will be in touch to agree the install date.
        </Alert>
        {/* When a deposit is due, straight on to pay it after accepting; a button when coming back later */}
        <DepositAfterAccept link={token} redirect={answer.isSuccess} />
      </>
    );
  }
  if (q.status === 'declined') return <Alert tone="info">You declined this quote. Thank you for letting us know.</Alert>;
  const error = answer.error ? (answer.error as Error).message : null;
  const accept = () => {
    setProblem(null);
    if (name.trim().length < 2) return setProblem('Type your full name to accept.');
    if (!agree) return setProblem('Tick the box to confirm you accept the terms.');
    answer.mutate({ accept: { name: name.trim(), acceptTerms: true } });
  };
  return (
    <Card>
      <Tabs
        label="Your answer"
        look="pill"
        value={mode}
        onValueChange={setMode}
        tabs={[
          { value: 'accept', label: 'Accept' },
          { value: 'decline', label: 'Decline' },
        ]}
      >
        {(problem || error) && <Alert>{problem ?? error}</Alert>}
        {mode === 'accept' ? (
          <form
            className="mt-2 flex flex-col gap-3"
            onSubmit={(e) => {
              e.preventDefault();
              accept();
            }}
          >
            <Field label="Your full name" required>
              <Input value={name} onChange={(e) => setName(e.target.value)} autoComplete="name" />
            </Field>
            <label className="flex items-start gap-2 text-sm">
              <input type="checkbox" className="mt-1" checked={agree} onChange={(e) => setAgree(e.target.checked)} />
              <span>I have read the quote and its terms and I accept them.</span>
            </label>
            {q.deposit && (
              <p className="text-sm font-medium" data-testid="deposit-before-accept">
                {depositSentence(q.deposit, (m) => formatMoney(m, q.currency, q.locale))} You go on to the card payment after accepting.
              </p>
            )}
            <div>
              <Button type="submit" busy={answer.isPending}>
                {q.deposit
                  ? `Accept and pay the ${formatMoney(q.deposit.amountMinor, q.currency, q.locale)} deposit`
                  : `Accept the quote (${formatMoney(q.totals.grossMinor, q.currency, q.locale)})`}
              </Button>
            </div>
          </form>
        ) : (
          <form
            className="mt-2 flex flex-col gap-3"
            onSubmit={(e) => {
              e.preventDefault();
              answer.mutate({ decline: { reason: reason.trim() } });
            }}
          >
            <Field label="Reason (optional)" hint="It helps us, but you do not have to say.">
              <Textarea rows={3} value={reason} onChange={(e) => setReason(e.target.value)} />
            </Field>
            <div>
              <Button type="submit" variant="danger" busy={answer.isPending}>
                Decline the quote
              </Button>
            </div>
          </form>
        )}
      </Tabs>
    </Card>
  );
}
