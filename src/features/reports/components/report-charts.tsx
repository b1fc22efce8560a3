import { Bar, BarChart, CartesianGrid, Legend, ReferenceLine, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import type { EstimateVsActualReport } from '../../../../shared/api/actuals';
import { PALETTE } from '../../../../shared/palette';
import { Card, CardTitle } from '../../../components/ui';

const axis = { fontSize: 12, fill: PALETTE.graphiteLight };
// Legend words in the text colour: in the series colour the pale allowance bar's label was hard to read.
const legend = { wrapperStyle: { fontSize: 12 }, formatter: (value: string) => <span style={{ color: PALETTE.graphite }}>{value}</span> };
// Bars drawn at their values at once: a report is read at a glance (and a screenshot shows the real figures).
const still = { isAnimationActive: false };

function ChartCard({ title, note, children }: { title: string; note: string; children: React.ReactElement }) {
  return (
    <Card className="min-w-0">
      <CardTitle>{title}</CardTitle>
      <p className="mb-2 text-sm text-graphite-light">{note}</p>
      <div className="h-64 w-full">
        <ResponsiveContainer width="100%" height="100%">
          {children}
        </ResponsiveContainer>
      </div>
    </Card>
  );
}

/** Waste per job against the allowance, m² per hour by installer, estimate error by estimator. Loaded with the report route only. */
export default function ReportCharts({ report }: { report: EstimateVsActualReport }) {
  const waste = report.rows
    .filter((r) => r.wasteIncurredPct !== null)
    .map((r) => ({ job: r.reference.replace(/^JOB-/, ''), incurred: r.wasteIncurredPct, allowance: r.wasteAllowancePct }));
  const installers = report.summary.byInstaller.map((i) => ({ name: i.name, rate: i.m2PerHour }));
  const estimators = report.summary.byEstimator.map((e) => ({ name: e.name, rolls: e.meanRollsErrorPct ?? 0, hours: e.meanHoursErrorPct ?? 0 }));
  return (
    <div className="grid gap-4 lg:grid-cols-2">
      <ChartCard title="Waste incurred against the allowance" note="Roll area used over the area laid, per job, %.">
        <BarChart data={waste} margin={{ top: 8, right: 8, bottom: 0, left: -16 }}>
          <CartesianGrid stroke={PALETTE.paperLine} vertical={false} />
          <XAxis dataKey="job" tick={axis} />
          <YAxis tick={axis} unit="%" />
          <Tooltip />
          <Legend {...legend} />
          <Bar dataKey="allowance" name="Allowance" fill={PALETTE.strawLight} {...still} />
          <Bar dataKey="incurred" name="Incurred" fill={PALETTE.strawDark} {...still} />
        </BarChart>
      </ChartCard>
      <ChartCard title="m² laid per hour by installer" note="Each job’s area shared by the hours each installer spent.">
        <BarChart data={installers} layout="vertical" margin={{ top: 8, right: 16, bottom: 0, left: 8 }}>
          <CartesianGrid stroke={PALETTE.paperLine} horizontal={false} />
          <XAxis type="number" tick={axis} />
          <YAxis type="category" dataKey="name" tick={axis} width={110} />
          <Tooltip />
          <Bar dataKey="rate" name="m²/h" fill={PALETTE.teal} {...still} />
        </BarChart>
      </ChartCard>
      <ChartCard title="Estimate error by estimator" note="Mean of (estimated − actual) / actual per job, %: above 0 over-estimated.">
        <BarChart data={estimators} margin={{ top: 8, right: 8, bottom: 0, left: -16 }}>
          <CartesianGrid stroke={PALETTE.paperLine} vertical={false} />
          <XAxis dataKey="name" tick={axis} />
          <YAxis tick={axis} unit="%" />
          <ReferenceLine y={0} stroke={PALETTE.graphite} />
          <Tooltip />
          <Legend {...legend} />
          <Bar dataKey="rolls" name="Rolls" fill={PALETTE.strawDark} {...still} />
          <Bar dataKey="hours" name="Hours" fill={PALETTE.tealDark} {...still} />
        </BarChart>
      </ChartCard>
    </div>
  );
}
