import { useNavigate } from 'react-router-dom';
import { formatMoney } from '../../../../shared/quote/money';
import { Alert, Button, Card, CardTitle, EmptyState, Spinner, formatDate } from '../../../components/ui';
import { useCreateQuote } from '../api/create-quote';
import { useJobQuotes } from '../api/get-job-quotes';
import { QuoteStatusBadge } from './quote-status-badge';

/** The job page's quotes: each version with its status and total, and a button to build one from the takeoffs. */
export function JobQuotesCard({ jobId }: { jobId: string }) {
  const quotes = useJobQuotes(jobId);
  const create = useCreateQuote(jobId);
  const navigate = useNavigate();
  const build = async () => {
    const q = await create.mutateAsync();
    navigate(`/jobs/${jobId}/quotes/${q.id}`);
  };
  return (
    <Card>
      <CardTitle
        action={
          <Button size="sm" onClick={() => void build().catch(() => undefined)} busy={create.isPending}>
            Build a quote from the takeoff
          </Button>
        }
      >
        Quotes
      </CardTitle>
      {create.error && <Alert>{create.error.message}</Alert>}
      {quotes.isPending && <Spinner />}
      {quotes.data && quotes.data.length === 0 && <EmptyState title="No quotes yet">Build one from the saved plans of this job's spaces.</EmptyState>}
      {quotes.data && quotes.data.length > 0 && (
        <ul className="divide-y divide-paper-line">
          {quotes.data.map((q) => (
            <li key={q.id} className="flex flex-wrap items-center justify-between gap-2 py-2">
              <button type="button" className="text-left font-medium text-teal-dark underline" onClick={() => navigate(`/jobs/${jobId}/quotes/${q.id}`)}>
                {q.number}
                {q.version > 1 ? ` v${q.version}` : ''}
              </button>
              <QuoteStatusBadge status={q.status} />
              <span className="font-mono text-sm">{formatMoney(q.grossMinor, q.currency)}</span>
              <span className="text-xs text-graphite-light">valid until {formatDate(q.validUntil)}</span>
            </li>
          ))}
        </ul>
      )}
    </Card>
  );
}
