import { memo } from 'react';
import type { Takeoff, TakeoffLayer } from '../../../shared/takeoff/compute-takeoff';
import type { PlanMessage } from '../../../shared/plan/plan-messages';
import { formatArea, formatLength } from '../geometry/units';
import type { Units } from '../store/session';
import type { TakeoffRun } from '../takeoff/run-takeoff';
import { RollCutList } from './roll-cut-list';

const money = (minor: number) => new Intl.NumberFormat('en-GB', { style: 'currency', currency: 'GBP', maximumFractionDigits: 0 }).format(minor / 100);

/** kWh always; money only when the viewer was given a fuel price (installers are not). */
function savingText(t: Takeoff): string {
  const kwh = `${Math.round(t.savings.fuelKwhPerYear)} kWh`;
  return t.savings.fuelPriceMinorPerKwh > 0 ? `${kwh} · ${money(t.savings.moneyMinorPerYear)}` : kwh;
}

const u = (x: number) => x.toFixed(2);

/** "100 mm good" and, when the condition takes credit away, what still counts. */
function existingText(t: Takeoff): string {
  const e = t.existing;
  if (e.condition === 'none' || e.depthMm === 0) return e.depthMm > 0 ? `${e.depthMm} mm, condition not set: counts as none` : 'none';
  return e.effectiveDepthMm === e.depthMm ? `${e.depthMm} mm ${e.condition}` : `${e.depthMm} mm ${e.condition}, counts as ${e.effectiveDepthMm} mm`;
}

/** The target and the figure it is judged on, named. */
function targetText(t: Takeoff): string {
  const met = t.thermal.meetsTarget ? 'met' : 'not met';
  if (t.thermal.targetJudgedOn === 'depth') return `${met} (depth)`;
  return `U ${t.thermal.targetUValue} ${met}, judged on the ${t.thermal.targetJudgedOn === 'whole-ceiling' ? 'whole ceiling' : 'insulated area'}`;
}

function Row({ label, value, testId, strong }: { label: string; value: string; testId?: string; strong?: boolean }) {
  return (
    <div className="flex justify-between gap-2 py-0.5">
      <dt className="text-graphite-light">{label}</dt>
      <dd className={`font-mono ${strong ? 'font-semibold text-graphite' : ''}`} data-testid={testId}>
        {value}
      </dd>
    </div>
  );
}

/** Strips of a layer grouped by cut length and width: "6 × 4200 × 380". */
function groupStripsByLength(layer: TakeoffLayer): { lengthMm: number; widthMm: number; count: number }[] {
  const m = new Map<string, { lengthMm: number; widthMm: number; count: number }>();
  for (const s of layer.strips) {
    const k = `${s.lengthMm}|${s.widthMm}`;
    const g = m.get(k) ?? { lengthMm: s.lengthMm, widthMm: s.widthMm, count: 0 };
    g.count++;
    m.set(k, g);
  }
  return [...m.values()].sort((a, b) => b.lengthMm - a.lengthMm || b.widthMm - a.widthMm);
}

function LayerBlock({ layer, units }: { layer: TakeoffLayer; units: Units }) {
  const base = layer.role === 'base';
  return (
    <section
      className={`rounded border-l-4 bg-white/60 px-2 py-1 ${base ? 'border-straw' : 'border-teal'}`}
      data-testid={`layer-${layer.role}-${layer.roleIndex}`}
    >
      <h4 className="text-sm font-semibold">{base ? 'Base layer (between joists)' : `Cross layer ${layer.roleIndex + 1} (over joists)`}</h4>
      <p className="text-xs text-graphite-light">{layer.productName}</p>
      <dl className="text-xs">
        <Row label="Area" value={formatArea(layer.areaM2, units)} testId={`layer-area-${layer.role}-${layer.roleIndex}`} />
        <Row label="Strips" value={`${layer.strips.length}, ${formatLength(layer.totalStripLengthMm, units)}${units === 'metric' ? ' mm' : ''} in all`} />
        <Row label="Rolls by packing" value={String(layer.rollsByPacking)} strong />
        <Row label="Rolls by rule of thumb" value={String(layer.rollsByArea)} />
        <Row label="Waste" value={`${layer.wastePct.toFixed(1)} %`} />
      </dl>
      <details className="text-xs">
        <summary className="cursor-pointer text-graphite-light">Strips by length × width</summary>
        <ul className="font-mono" data-testid={`strip-sizes-${layer.role}-${layer.roleIndex}`}>
          {groupStripsByLength(layer).map((g) => (
            <li key={`${g.lengthMm}|${g.widthMm}`}>
              {g.count} × {formatLength(g.lengthMm, units)} × {formatLength(g.widthMm, units)}
              {units === 'metric' ? ' mm' : ''}
            </li>
          ))}
          {(layer.fills ?? []).length > 0 && (
            <li className="font-sans text-graphite-light">
              + {layer.fills.length} sliver{layer.fills.length > 1 ? 's' : ''} to fill from offcuts
            </li>
          )}
        </ul>
      </details>
    </section>
  );
}

function Messages({ items, tone }: { items: PlanMessage[]; tone: 'error' | 'warning' }) {
  if (!items.length) return null;
  return (
    <ul className={`space-y-1 text-xs ${tone === 'error' ? 'text-brick' : 'text-straw-dark'}`} data-testid={`takeoff-${tone}s`}>
      {items.map((m, i) => (
        <li key={i}>
          {tone === 'error' ? '⚠ ' : '• '}
          {m.message}
        </li>
      ))}
    </ul>
  );
}

function Summary({ t, units }: { t: Takeoff; units: Units }) {
  return (
    <>
      <dl className="text-sm">
        <Row label="Gross area" value={formatArea(t.grossAreaM2, units)} testId="gross-area" />
        <Row label="Net area" value={formatArea(t.netAreaM2, units)} testId="net-area" strong />
        <Row label="Excluded" value={formatArea(t.excludedAreaM2, units)} />
        <Row label="Eaves bands" value={formatArea(t.eavesBandAreaM2, units)} />
      </dl>
      <div className="space-y-2">
        {t.layers.map((l) => (
          <LayerBlock key={`${l.role}${l.roleIndex}`} layer={l} units={units} />
        ))}
      </div>
      {t.layers.length === 0 && <p className="text-xs text-graphite-light">No new layers needed for this target.</p>}
      {t.rollsPerProduct.length > 0 && (
        <section>
          <h4 className="text-sm font-semibold">Rolls</h4>
          <table className="w-full text-xs">
            <thead>
              <tr className="align-bottom leading-tight text-graphite-light">
                <th className="pb-0.5 text-left font-normal">Product</th>
                <th className="w-16 px-1 pb-0.5 text-center font-normal" title="Rolls counted by packing the strips into whole rolls">
                  By packing
                </th>
                <th className="w-16 px-1 pb-0.5 text-center font-normal" title="Rolls by rule of thumb: area ÷ roll area, plus waste (common practice)">
                  Rule of thumb
                </th>
              </tr>
            </thead>
            <tbody className="font-mono">
              {t.rollsPerProduct.map((r) => (
                <tr key={r.productId}>
                  <td className="font-sans">{r.productName}</td>
                  <td className="text-center" data-testid="rolls-packing">
                    {r.rollsByPacking}
                  </td>
                  <td className="text-center">{r.rollsByArea}</td>
                </tr>
              ))}
            </tbody>
          </table>
          <RollCutList t={t} units={units} />
        </section>
      )}
      <section>
        <h4 className="text-sm font-semibold">Heat loss</h4>
        <dl className="text-xs">
          <Row label="Existing" value={existingText(t)} testId="existing-condition-row" />
          <Row label="U insulated area (ISO 6946)" value={`${u(t.uValueBefore)} → ${u(t.uValueAfter)}`} testId="u-insulated" />
          <Row label="U whole ceiling" value={`${u(t.uValueBeforeWholeCeiling)} → ${u(t.uValueAfterWholeCeiling)}`} testId="u-whole" strong />
          <Row label="RdSAP default (Table S9)" value={`${u(t.thermal.before.rdsapU)} → ${u(t.thermal.after.rdsapU)}`} testId="u-rdsap" />
          {units === 'imperial' && <Row label="R before → after" value={`R-${t.rValueBeforeImperial.toFixed(0)} → R-${t.rValueAfterImperial.toFixed(0)}`} />}
          <Row label="Target" value={targetText(t)} testId="target-row" />
          {t.eaves.mode === 'ventilators' && <Row label="Eaves ventilators" value={String(t.eaves.ventilatorCount)} testId="eaves-ventilators" />}
          <Row label="Saving a year (estimate)" value={savingText(t)} testId="saving" />
        </dl>
        <p className="text-[11px] text-graphite-faint">
          U in W/m²K. Whole ceiling: area-weighted over the insulated area, hatch, boards, downlights and eaves strip. {t.savings.note}
        </p>
      </section>
      {t.siteChecks.length > 0 && (
        <section>
          <h4 className="text-sm font-semibold">Site checks</h4>
          <ul className="list-disc space-y-1 pl-4 text-xs" data-testid="site-checks">
            {t.siteChecks.map((c) => (
              <li key={c.code}>{c.message}</li>
            ))}
          </ul>
          <p className="mt-1 text-[11px] text-graphite-faint">Reminders only: follow local building regulations, electrical rules and licensed practice.</p>
        </section>
      )}
    </>
  );
}

/** The live takeoff beside the plan; memoised so a drag that does not change it costs nothing here. */
export const TakeoffPanel = memo(function TakeoffPanel({ run, units, stale }: { run: TakeoffRun | null; units: Units; stale?: boolean }) {
  return (
    <aside
      className={`flex h-full flex-col gap-3 overflow-y-auto border-l border-graphite/15 bg-paper/95 p-3 transition-opacity ${stale ? 'opacity-60' : ''}`}
      aria-label="Live takeoff"
      data-testid="takeoff-panel"
    >
      <h3 className="font-semibold">Takeoff</h3>
      {!run && <p className="text-sm text-graphite-light">Working…</p>}
      {run && !run.takeoff && run.errors.length === 0 && <p className="text-sm text-graphite-light">Draw or type the outline to see the takeoff.</p>}
      {run && <Messages items={run.errors} tone="error" />}
      {run?.takeoff && <Summary t={run.takeoff} units={units} />}
      {run && (
        <Messages items={[...run.warnings, ...(run.takeoff?.warnings.filter((w) => !run.warnings.some((v) => v.code === w.code)) ?? [])]} tone="warning" />
      )}
    </aside>
  );
});
