import type { VanLoad as VanLoadData } from '../../../../shared/api/job-sheet';

/** What goes in the van: rolls per product and the extras. Quantities only, never prices. */
export function VanLoad({ load }: { load: VanLoadData }) {
  return (
    <div className="text-lg">
      {load.rolls.length === 0 && load.extras.length === 0 && <p className="text-base text-graphite-light">Nothing listed yet.</p>}
      <ul className="flex flex-col gap-1">
        {load.rolls.map((r) => (
          <li key={`${r.productName}-${r.thicknessMm}`} className="flex justify-between gap-3 border-b border-graphite/10 py-1">
            <span>
              {r.productName}
              {!r.productName.includes(`${r.thicknessMm} mm`) && <span className="text-graphite-light"> ({r.thicknessMm} mm)</span>}
            </span>
            <span className="shrink-0 whitespace-nowrap font-mono font-bold">
              {r.count} roll{r.count === 1 ? '' : 's'}
            </span>
          </li>
        ))}
        {load.extras.map((x) => (
          <li key={x.label} className="flex justify-between gap-3 border-b border-graphite/10 py-1">
            <span>{x.label}</span>
            <span className="shrink-0 whitespace-nowrap font-mono font-bold">
              {x.quantity} {x.unit}
            </span>
          </li>
        ))}
      </ul>
    </div>
  );
}
