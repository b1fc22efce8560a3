import { useQueryClient } from '@tanstack/react-query';
import type { VanLoad } from '../../../../shared/api/job-sheet';
import type { JobComparison } from '../../../../shared/reports/estimate-vs-actual';
import { formatMoney } from '../../../../shared/quote/money';
import { Card, CardTitle, formatDateTime, Table, TBody, Td, Th, THead, Tr } from '../../../components/ui';
import { ActualsEditor } from '../../job-sheet';
import { reportKeys, useJobEstimateVsActual } from '../api/estimate-vs-actual';

/** The job's products and extras as the correction form lists them, with the estimate beside each. */
function estimateLoad(c: JobComparison): VanLoad {
  return {
    rolls: c.products.map((p) => ({ productId: p.productId, productName: p.productName, thicknessMm: 0, count: p.estimated })),
    extras: c.extras.map((x) => ({ code: x.code as VanLoad['extras'][number]['code'], label: x.label, quantity: x.estimated, unit: '' })),
  };
}

const n = (v: number | null) => (v === null ? '–' : String(Number(v.toFixed(2))));

/** The office job page's estimate against actual: rolls by packing, rule of thumb and used; hours; cost difference and margin made. */
export function JobActualsCard({ jobId, installer }: { jobId: string; installer?: { id: string; name: string } | null }) {
  const q = useJobEstimateVsActual(jobId);
  const qc = useQueryClient();
  const c = q.data?.comparison;
  if (!q.data?.finished || !c) return null;
  const people = [...c.hours.map((h) => ({ id: h.userId, name: h.name }))];
  if (installer && !people.some((p) => p.id === installer.id)) people.push(installer);
  const edited = q.data.actuals?.edited;
  const money = (m: number | null) => (m === null ? '–' : formatMoney(m, q.data!.currency));
  const estCost = c.estimatedMaterialCostMinor + c.estimatedLabourCostMinor;
  const actCost = c.actualMaterialCostMinor + c.actualLabourCostMinor;
  return (
    <Card data-testid="job-actuals-card">
      <CardTitle>Estimate against actual</CardTitle>
      <p className="mb-2 text-sm text-graphite-light">
        {q.data.recorded
          ? `Recorded by ${q.data.recorded.by}, ${formatDateTime(q.data.recorded.at)}.`
          : 'Nothing was recorded on finishing: the costs below are the estimate.'}
        {edited && ` Corrected by ${edited.by}, ${formatDateTime(edited.at)}.`}
      </p>
      {/* On a phone each product is a line of labelled counts: the table's last columns (used, back) scroll off there. */}
      <ul className="divide-y divide-paper-line text-sm sm:hidden" aria-label="Rolls per product">
        {c.products.map((p) => (
          <li key={p.productId} className="py-1.5">
            <div>{p.productName}</div>
            <div className="text-graphite-light">
              packing {p.byPacking} · rule of thumb {p.byRuleOfThumb} · used <span className="text-graphite">{n(p.used)}</span> · back {n(p.returned)}
            </div>
          </li>
        ))}
      </ul>
      <div className="hidden sm:block">
        <Table>
          <THead>
            <Tr>
              <Th>Product</Th>
              <Th className="text-right">Packing</Th>
              <Th className="text-right">Rule of thumb</Th>
              <Th className="text-right">Used</Th>
              <Th className="text-right">Back</Th>
            </Tr>
          </THead>
          <TBody>
            {c.products.map((p) => (
              <Tr key={p.productId}>
                <Td>{p.productName}</Td>
                <Td className="text-right font-mono">{p.byPacking}</Td>
                <Td className="text-right font-mono">{p.byRuleOfThumb}</Td>
                <Td className="text-right font-mono">{n(p.used)}</Td>
                <Td className="text-right font-mono">{n(p.returned)}</Td>
              </Tr>
            ))}
          </TBody>
        </Table>
      </div>
      <dl className="mt-3 grid grid-cols-2 gap-x-4 gap-y-1 text-sm sm:grid-cols-4">
        <dt className="text-graphite-light">Waste / allowed</dt>
        <dd className="font-mono">
          {n(c.wasteIncurredPct)}% / {n(c.wasteAllowancePct)}%
        </dd>
        <dt className="text-graphite-light">Hours est. / spent</dt>
        <dd className="font-mono">
          {n(c.estimatedHours)} / {n(c.actualHours)}
        </dd>
        <dt className="text-graphite-light">Material cost diff.</dt>
        <dd className="font-mono">{money(c.actualMaterialCostMinor - c.estimatedMaterialCostMinor)}</dd>
        <dt className="text-graphite-light">Labour cost diff.</dt>
        <dd className="font-mono">{money(c.actualLabourCostMinor - c.estimatedLabourCostMinor)}</dd>
        <dt className="text-graphite-light">Cost est. / actual</dt>
        <dd className="font-mono">
          {money(estCost)} / {money(actCost)}
        </dd>
        <dt className="text-graphite-light">Margin est. / made</dt>
        <dd className="font-mono">
          {money(c.estimatedMarginMinor)} / {money(c.actualMarginMinor)}
        </dd>
      </dl>
      {q.data.actuals && q.data.editable && (
        <details className="mt-3">
          <summary className="cursor-pointer text-sm font-semibold">What was used, as recorded</summary>
          <div className="mt-2 text-sm">
            <ActualsEditor
              jobId={jobId}
              load={estimateLoad(c)}
              people={people}
              stored={q.data.actuals}
              editable
              countLabel="estimated"
              onSaved={() => qc.invalidateQueries({ queryKey: reportKeys.all })}
            />
          </div>
        </details>
      )}
    </Card>
  );
}
