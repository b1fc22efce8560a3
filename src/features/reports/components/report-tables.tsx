import { Link } from 'react-router-dom';
import type { EstimateVsActualReport, ReportRow } from '../../../../shared/api/actuals';
import { formatMoney } from '../../../../shared/quote/money';
import { LOFT_SHAPE_LABELS } from '../../../../shared/reports/estimate-vs-actual';
import { Card, CardTitle, Table, TBody, Td, Th, THead, Tr } from '../../../components/ui';

const n = (v: number | null, unit = '') => (v === null ? '–' : `${Number(v.toFixed(2))}${unit}`);
const signed = (v: number | null) => (v === null ? '–' : `${v > 0 ? '+' : ''}${Number(v.toFixed(1))}%`);
const costOver = (r: ReportRow) => r.actualMaterialCostMinor + r.actualLabourCostMinor - r.estimatedMaterialCostMinor - r.estimatedLabourCostMinor;

/**
 * On a phone each job is a short block of labelled figures instead of a table row: a wide table
 * there scrolls sideways and hides its last columns (the cost and margin, what the office looks for).
 */
function PhoneJobs({ rows, figures, label }: { rows: ReportRow[]; figures: (r: ReportRow) => [string, string][]; label: string }) {
  return (
    <ul className="divide-y divide-paper-line sm:hidden" aria-label={label}>
      {rows.map((r) => (
        <li key={r.jobId} className="py-2">
          <Link className="font-mono text-teal-dark underline" to={`/jobs/${r.jobId}`}>
            {r.reference}
          </Link>
          <dl className="mt-1 grid grid-cols-[auto_1fr] gap-x-3 text-sm">
            {figures(r).map(([k, v]) => (
              <div key={k} className="contents">
                <dt className="text-graphite-light">{k}</dt>
                <dd className="text-right font-mono">{v}</dd>
              </div>
            ))}
          </dl>
        </li>
      ))}
    </ul>
  );
}

/** m² per hour by loft shape, and the jobs whose cost was furthest from the estimate. */
export function ReportTables({ report }: { report: EstimateVsActualReport }) {
  const signedMoney = (m: number) => `${m > 0 ? '+' : ''}${formatMoney(m, report.currency)}`;
  const byId = new Map(report.rows.map((r) => [r.jobId, r]));
  const off = report.summary.furthestOff.map((id) => byId.get(id)).filter((r): r is ReportRow => !!r);
  return (
    <div className="grid gap-4 lg:grid-cols-2">
      <Card className="min-w-0">
        <CardTitle>m² per hour by loft shape</CardTitle>
        <Table>
          <THead>
            <Tr>
              <Th>Shape</Th>
              <Th className="text-right">Jobs</Th>
              <Th className="text-right">Hours</Th>
              <Th className="text-right">m²/h</Th>
            </Tr>
          </THead>
          <TBody>
            {report.summary.byShape.map((s) => (
              <Tr key={s.shape}>
                <Td>{LOFT_SHAPE_LABELS[s.shape]}</Td>
                <Td className="text-right font-mono">{s.jobs}</Td>
                <Td className="text-right font-mono">{n(s.hours)}</Td>
                <Td className="text-right font-mono">{n(s.m2PerHour)}</Td>
              </Tr>
            ))}
          </TBody>
        </Table>
      </Card>
      <Card className="min-w-0">
        <CardTitle>Jobs furthest off</CardTitle>
        <PhoneJobs
          rows={off}
          label="Jobs furthest off"
          figures={(r) => [
            ['Rolls, estimate against used', signed(r.rollsErrorPct)],
            ['Hours, estimate against spent', signed(r.hoursErrorPct)],
            ['Cost over the estimate', signedMoney(costOver(r))],
          ]}
        />
        <div className="hidden sm:block">
          <Table>
            <THead>
              <Tr>
                <Th>Job</Th>
                <Th className="text-right">Rolls</Th>
                <Th className="text-right">Hours</Th>
                <Th className="text-right">Cost vs estimate</Th>
              </Tr>
            </THead>
            <TBody>
              {off.map((r) => (
                <Tr key={r.jobId}>
                  <Td>
                    <Link className="whitespace-nowrap font-mono text-teal-dark underline" to={`/jobs/${r.jobId}`}>
                      {r.reference}
                    </Link>
                  </Td>
                  <Td className="text-right font-mono">{signed(r.rollsErrorPct)}</Td>
                  <Td className="text-right font-mono">{signed(r.hoursErrorPct)}</Td>
                  <Td className="whitespace-nowrap text-right font-mono">{signedMoney(costOver(r))}</Td>
                </Tr>
              ))}
            </TBody>
          </Table>
        </div>
      </Card>
    </div>
  );
}

/** Every job of the period: rolls by packing, rule of thumb and used; waste against allowance; hours; margin made. */
export function ReportJobsTable({ report }: { report: EstimateVsActualReport }) {
  return (
    <Card className="min-w-0">
      <CardTitle>Jobs in the period</CardTitle>
      <PhoneJobs
        rows={report.rows}
        label="Jobs in the period"
        figures={(r) => [
          ['Rolls: packing / rule of thumb', `${r.packingRolls} / ${r.ruleOfThumbRolls}`],
          ['Used (back)', `${n(r.usedRolls)} (${n(r.returnedRolls)})`],
          ['Waste / allowed', `${n(r.wasteIncurredPct, '%')} / ${n(r.wasteAllowancePct, '%')}`],
          ['Hours est. / actual', `${n(r.estimatedHours)} / ${n(r.actualHours)}`],
          ['Margin made', r.actualMarginMinor === null ? '–' : formatMoney(r.actualMarginMinor, report.currency)],
        ]}
      />
      <div className="hidden sm:block">
        <Table>
          <THead>
            <Tr>
              <Th>Job</Th>
              <Th className="text-right">Packing</Th>
              <Th className="text-right">Rule of thumb</Th>
              <Th className="text-right">Used (back)</Th>
              <Th className="text-right">Waste / allowed</Th>
              <Th className="text-right">Hours est. / actual</Th>
              <Th className="text-right">Margin made</Th>
            </Tr>
          </THead>
          <TBody>
            {report.rows.map((r) => (
              <Tr key={r.jobId}>
                <Td>
                  <Link className="whitespace-nowrap font-mono text-teal-dark underline" to={`/jobs/${r.jobId}`}>
                    {r.reference}
                  </Link>
                </Td>
                <Td className="text-right font-mono">{r.packingRolls}</Td>
                <Td className="text-right font-mono">{r.ruleOfThumbRolls}</Td>
                <Td className="text-right font-mono">
                  {n(r.usedRolls)} ({n(r.returnedRolls)})
                </Td>
                <Td className="whitespace-nowrap text-right font-mono">
                  {n(r.wasteIncurredPct, '%')} / {n(r.wasteAllowancePct, '%')}
                </Td>
                <Td className="whitespace-nowrap text-right font-mono">
                  {n(r.estimatedHours)} / {n(r.actualHours)}
                </Td>
                <Td className="whitespace-nowrap text-right font-mono">
                  {r.actualMarginMinor === null ? '–' : formatMoney(r.actualMarginMinor, report.currency)}
                </Td>
              </Tr>
            ))}
          </TBody>
        </Table>
      </div>
    </Card>
  );
}
