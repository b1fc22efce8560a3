import { useState } from 'react';
import { useNavigate, useParams } from 'react-router-dom';
import type { Quote } from '../../../../shared/api/quotes';
import { ErrorState, LoadingState } from '../../../components/ui';
import { useQuote } from '../api/get-quote';
import { QuoteBuilder } from './quote-builder';

/** The quote builder's page: loads the quote and starts the form afresh for each version the server returns. */
export default function QuotePage() {
  const { id: jobId = '', quoteId = '' } = useParams();
  const navigate = useNavigate();
  const quote = useQuote(quoteId);
  // Kept here, not in the form: it outlives the form that a saved version replaces.
  const [message, setMessage] = useState<string | null>(null);

  // Each quote version from the server resets the form (adjusted during render, not in an effect).
  const [shown, setShown] = useState<Quote | undefined>(undefined);
  const [generation, setGeneration] = useState(0);
  if (quote.data !== shown) {
    setShown(quote.data);
    setGeneration((g) => g + 1);
  }

  // The error first: a failed load has no data, and would otherwise spin for ever.
  if (quote.isError) return <ErrorState error={quote.error} onRetry={() => quote.refetch()} title="The quote could not be loaded" />;
  if (quote.isPending) return <LoadingState label="Loading the quote…" />;
  const q = quote.data;

  function onSaved(saved: Quote) {
    if (saved.id !== q.id) {
      setMessage(`Saved as version ${saved.version}; version ${q.version} is kept as it was sent.`);
      navigate(`/jobs/${jobId}/quotes/${saved.id}`, { replace: true });
    } else setMessage('Saved.');
  }

  return <QuoteBuilder key={generation} quote={q} jobId={jobId} message={message} onMessage={setMessage} onSaved={onSaved} />;
}
