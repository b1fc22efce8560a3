import type { Takeoff } from '../../../shared/takeoff/compute-takeoff';
import { formatArea, formatLength } from '../geometry/units';
import type { Units } from '../store/session';

/** One cut as the installer reads it: strip, part, length, and the width where it is cut narrower. */
function cutText(c: { label: string; part: number; parts: number; lengthMm: number; widthMm: number; lengthwise?: boolean }, units: Units): string {
  const unit = units === 'metric' ? ' mm' : '';
  const part = c.parts > 1 ? ` (${c.part}/${c.parts})` : '';
  const width = c.lengthwise ? ` × ${formatLength(c.widthMm, units)}${unit}` : '';
  return `${c.label}${part} ${formatLength(c.lengthMm, units)}${unit}${width}`;
}

/**
 * The roll plan as a cut list, per product and roll: each lane's cuts in order and what is left,
 * then the strips cut from offcuts and the slivers to fill. Folded by default (it is long).
 */
export function RollCutList({ t, units }: { t: Takeoff; units: Units }) {
  const unit = units === 'metric' ? ' mm' : '';
  return (
    <>
      {(t.rollPlan ?? []).map((rp) => (
        <details key={rp.productId} className="text-xs" data-testid={`cut-list-${rp.productId}`}>
          <summary className="cursor-pointer text-graphite-light">
            Cut list: {rp.productName} ({rp.rolls} rolls, lower bound {rp.rollsLowerBound})
          </summary>
          <ol className="space-y-0.5 font-mono">
            {rp.lanes.map((l) => (
              <li key={`${l.roll}.${l.lane}`}>
                Roll {l.roll}
                {t.layers.find((x) => x.productId === rp.productId)?.lanesPerRoll !== 1 ? `.${l.lane}` : ''}: {l.cuts.map((c) => cutText(c, units)).join(' · ')}
                {l.leftoverMm > 0 && ` — left ${formatLength(l.leftoverMm, units)}${unit}${l.leftover === 'keep' ? ' (keep)' : ' (for filling)'}`}
              </li>
            ))}
          </ol>
          {rp.fromOffcuts.length > 0 && (
            <p className="mt-1">
              From offcuts: {rp.fromOffcuts.map((c) => `${cutText({ ...c, lengthwise: c.widthMm < rp.laneWidthMm - 0.5 }, units)} from ${c.from}`).join('; ')}
            </p>
          )}
          {rp.fills.map((f) => (
            <p key={f.layer} className="mt-1">
              Fill from offcuts ({f.layer}): {f.count} sliver{f.count > 1 ? 's' : ''}, {formatArea(f.areaM2, units)}
            </p>
          ))}
        </details>
      ))}
    </>
  );
}
