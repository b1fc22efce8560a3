import { formatMoney } from '../../../../shared/quote/money';
import { Card, CardTitle, formatDateTime, Table, TBody, Td, Th, THead, Tr } from '../../../components/ui';
import { useJobEstimateVsActual } from '../api/estimate-vs-actual';

const n = (v: number | null) => (v === null ? '–' : String(Number(v.toFixed(2))));

/** The office job page's estimate against actual: rolls by packing, rule of thumb and used; hours; cost difference and margin made. */
export function JobActualsCard({ jobId }: { jobId: string }) {
  const q = useJobEstimateVsActual(jobId);
  const c = q.data?.comparison;
  if (!q.data?.finished || !c) return null;
  const money = (m: number | null) => (m === null ? '–' : formatMoney(m, q.data!.currency));
  const estCost = c.estimatedMaterialCostMinor + c.estimatedLabourCostMinor;
  const actCost = c.actualMaterialCostMinor + c.actualLabourCostMinor;
  return (
    <Card>
      <CardTitle>Estimate against actual</CardTitle>
      <p className="mb-2 text-sm text-graphite-light">
        {q.data.recorded
          ? `Recorded by ${q.data.recorded.by}, ${formatDateTime(q.data.recorded.at)}.`
          : 'Nothing was recorded on finishing: the costs below are the estimate.'}
      </p>
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
    </Card>
  );
}
