import { Alert, Button, Card, CardTitle, formatDateTime } from '../../../components/ui';
import { isApiError } from '../../../lib/api-client';
import { useApplySuggestion, useSuggestions } from '../api/estimate-vs-actual';

const CONFIDENCE: Record<string, string> = { low: 'Low confidence', medium: 'Medium confidence', high: 'High confidence' };

/** Waste allowance and laying rates recomputed from the last 20 finished jobs; Apply sets the company setting. */
export function SuggestionsCard() {
  const q = useSuggestions();
  const apply = useApplySuggestion();
  if (!q.data) return null;
  const { suggestions: s, history } = q.data;
  return (
    <Card>
      <CardTitle>Suggestions from the last {s.lastN} finished jobs</CardTitle>
      {apply.error && <Alert tone="error">{isApiError(apply.error) ? apply.error.message : 'Could not apply the suggestion.'}</Alert>}
      <div className="grid gap-3 sm:grid-cols-2">
        {s.waste && (
          <div className="rounded-md border border-paper-line bg-paper/60 p-3">
            <p className="font-semibold">
              Waste allowance: {s.waste.currentPct}% → {s.waste.suggestedPct}%
            </p>
            <p className="text-sm text-graphite-light">
              {CONFIDENCE[s.waste.confidence]}. {s.waste.note}
            </p>
            <Button
              className="mt-2"
              size="sm"
              disabled={apply.isPending || s.waste.suggestedPct === s.waste.currentPct}
              onClick={() => apply.mutate({ kind: 'waste-allowance', expectedPct: s.waste!.suggestedPct })}
            >
              Apply {s.waste.suggestedPct}%
            </Button>
          </div>
        )}
        {s.laying && (
          <div className="rounded-md border border-paper-line bg-paper/60 p-3">
            <p className="font-semibold">
              Laying rates: base {s.laying.current.baseM2PerHour} → {s.laying.suggested.baseM2PerHour} m²/h, cross {s.laying.current.crossM2PerHour} →{' '}
              {s.laying.suggested.crossM2PerHour} m²/h
            </p>
            <p className="text-sm text-graphite-light">
              {CONFIDENCE[s.laying.confidence]}. {s.laying.note}
            </p>
            <Button className="mt-2" size="sm" disabled={apply.isPending} onClick={() => apply.mutate({ kind: 'laying-rates', expected: s.laying!.suggested })}>
              Apply rates
            </Button>
          </div>
        )}
      </div>
      {s.notes.map((n) => (
        <p key={n} className="mt-2 text-sm text-graphite-light">
          {n}
        </p>
      ))}
      {history.length > 0 && (
        <ul className="mt-3 text-sm text-graphite-light" aria-label="Settings changed from suggestions">
          {history.slice(0, 5).map((h) => (
            <li key={h.id}>
              {formatDateTime(h.at)}: {h.by} set {h.setting === 'wasteAllowance' ? 'the waste allowance' : 'the laying rates'} from {JSON.stringify(h.oldValue)}{' '}
              to {JSON.stringify(h.newValue)}
            </li>
          ))}
        </ul>
      )}
    </Card>
  );
}
