import { lazy, Suspense, useState } from 'react';
import { addDaysIso, todayIso } from '../../../../shared/dates';
import { formatMoney } from '../../../../shared/quote/money';
import { Button, Card, EmptyState, ErrorState, LoadingState, PageHeader } from '../../../components/ui';
import { useReport } from '../api/estimate-vs-actual';
import { reportCsv } from '../report-csv';
import { ReportJobsTable, ReportTables } from './report-tables';
import { SuggestionsCard } from './suggestions-card';

// recharts is a chunk of its own, fetched only when there is something to draw.
const ReportCharts = lazy(() => import('./report-charts'));

const PERIODS = [
  { days: 90, label: 'Last 3 months' },
  { days: 365, label: 'Last 12 months' },
  { days: 3650, label: 'All' },
];

function download(text: string, name: string) {
  const url = URL.createObjectURL(new Blob([text], { type: 'text/csv;charset=utf-8' }));
  const a = Object.assign(document.createElement('a'), { href: url, download: name });
  a.click();
  URL.revokeObjectURL(url);
}

/** Estimate against actual over a chosen period: totals, charts, tables, suggestions and a CSV export (office). */
export default function ReportPage() {
  const [to, setTo] = useState(todayIso());
  const [from, setFrom] = useState(addDaysIso(todayIso(), -365));
  const q = useReport(from, to);
  const r = q.data;
  const stat = (label: string, value: string) => (
    <div className="rounded-md border border-paper-line bg-white/85 px-3 py-2">
      <div className="text-xs uppercase tracking-wide text-graphite-light">{label}</div>
      <div className="font-mono text-lg font-semibold">{value}</div>
    </div>
  );
  return (
    <div className="flex flex-col gap-4">
      <PageHeader title="Estimate against actual" />
      <Card className="flex flex-wrap items-end gap-3">
        {PERIODS.map((p) => (
          <Button
            key={p.days}
            size="sm"
            variant={from === addDaysIso(to, -p.days) ? 'primary' : 'secondary'}
            onClick={() => {
              setTo(todayIso());
              setFrom(addDaysIso(todayIso(), -p.days));
            }}
          >
            {p.label}
          </Button>
        ))}
        <label className="flex flex-col text-sm">
          From
          <input
            type="date"
            className="h-9 rounded-md border border-paper-line bg-white px-2"
            value={from}
            max={to}
            onChange={(e) => e.target.value && setFrom(e.target.value)}
          />
        </label>
        <label className="flex flex-col text-sm">
          To
          <input
            type="date"
            className="h-9 rounded-md border border-paper-line bg-white px-2"
            value={to}
            min={from}
            onChange={(e) => e.target.value && setTo(e.target.value)}
          />
        </label>
        <Button
          size="sm"
          variant="secondary"
          disabled={!r?.rows.length}
          onClick={() => r && download(reportCsv(r.rows), `estimate-vs-actual-${from}-${to}.csv`)}
        >
          Export CSV
        </Button>
      </Card>
      {q.isPending && <LoadingState label="Working out the report…" />}
      {q.isError && <ErrorState error={q.error} onRetry={() => q.refetch()} title="The report could not be loaded" />}
      {r && r.rows.length === 0 && <EmptyState title="No finished jobs with actuals in this period" />}
      {r && r.rows.length > 0 && (
        <>
          <div className="grid grid-cols-2 gap-2 sm:grid-cols-3 lg:grid-cols-6" data-testid="report-totals">
            {stat('Jobs', String(r.summary.jobsCounted))}
            {stat('Rolls est. / used', `${r.summary.estimatedRolls} / ${r.summary.usedRolls}`)}
            {stat('Waste / allowed', `${r.summary.wasteIncurredPct ?? '–'}% / ${r.summary.wasteAllowancePct ?? '–'}%`)}
            {stat('Hours est. / actual', `${r.summary.estimatedHours} / ${r.summary.actualHours}`)}
            {stat('Cost vs estimate', formatMoney(r.summary.actualCostMinor - r.summary.estimatedCostMinor, r.currency))}
            {stat('Margin made', formatMoney(r.summary.actualMarginMinor, r.currency))}
          </div>
          <SuggestionsCard />
          <Suspense fallback={<LoadingState label="Drawing the charts…" />}>
            <ReportCharts report={r} />
          </Suspense>
          <ReportTables report={r} />
          <ReportJobsTable report={r} />
        </>
      )}
    </div>
  );
}
