import type { SheetSpace } from '../../../../shared/api/job-sheet';
import { tickKey, type ShownTick } from '../merge-pending';
import { TickButton } from './tick-button';

type Props = {
  space: SheetSpace;
  ticks: Map<string, ShownTick>;
  onTick: (kind: 'strip-cut' | 'strip-laid', ref: string, done: boolean) => void;
};

const mm = (n: number) => `${Math.round(n)} mm`;

/** The cut list of one space: per layer, roll by roll and lane by lane, each piece in laying order with Cut and Laid ticks. */
export function CutList({ space, ticks, onTick }: Props) {
  if (space.rolls.length === 0) return <p className="text-base text-graphite-light">No strips to cut for this space.</p>;
  return (
    <div className="flex flex-col gap-4">
      {space.layers.map((layer) => {
        const rolls = space.rolls.filter((r) => r.layerKey === layer.key);
        if (rolls.length === 0) return null;
        const laidCount = layer.strips.filter((s) => ticks.get(tickKey('strip-laid', space.id, s.id))?.done).length;
        return (
          <section key={layer.key} aria-label={`Cut list, ${layer.label}`}>
            <h4 className="text-lg font-bold">
              {layer.label}: {layer.productName}
              {!layer.productName.includes(`${layer.thicknessMm} mm`) && ` ${layer.thicknessMm} mm`}
            </h4>
            <p className="mb-2 text-base text-graphite-light">
              {layer.strips.length} strips · {laidCount} laid · lay {layer.role === 'base' ? 'between the joists, along them' : 'across the joists'}
            </p>
            {rolls.map((roll) => (
              <div key={`${roll.layerKey}-${roll.rollNo}`} className="mb-3 rounded-md border-2 border-graphite/25 bg-white">
                <div className="border-b-2 border-graphite/15 bg-paper-dark px-3 py-2 text-lg font-bold">Roll {roll.rollNo}</div>
                {roll.lanes.map((lane) => (
                  <div key={lane.lane} className="px-3 py-2">
                    {roll.lanes.length > 1 && (
                      <div className="text-base font-semibold text-timber">
                        Lane {lane.lane} · {mm(lane.widthMm)} wide
                      </div>
                    )}
                    <ol className="flex flex-col divide-y divide-graphite/10">
                      {lane.cuts.map((cut) => (
                        <li key={cut.id} className="py-2">
                          <div className="flex items-baseline gap-3">
                            <span className="min-w-[3.5ch] font-mono text-xl font-bold">{cut.stripLabel}</span>
                            <span className="whitespace-nowrap font-mono text-xl">
                              {mm(cut.lengthMm)}
                              {cut.widthMm !== undefined && ` × ${mm(cut.widthMm)}`}
                            </span>
                            {cut.widthMm !== undefined && <span className="text-base text-graphite-light">cut lengthwise</span>}
                            {cut.pieceCount > 1 && (
                              <span className="text-base text-graphite-light">
                                piece {cut.piece} of {cut.pieceCount}
                              </span>
                            )}
                          </div>
                          {cut.fromOffcut && <div className="text-base text-graphite-light">from the offcut: {cut.fromOffcut}</div>}
                          <div className="mt-1 flex gap-2">
                            <TickButton
                              label="Cut"
                              tick={ticks.get(tickKey('strip-cut', space.id, cut.id))}
                              onToggle={(d) => onTick('strip-cut', cut.id, d)}
                              testId={`cut-${cut.id}`}
                            />
                            {/* Laid is a tick of the whole strip: offered once, on its last piece, so tapping
                                two pieces of one strip cannot undo the first tap. */}
                            {cut.piece === cut.pieceCount ? (
                              <TickButton
                                label={cut.pieceCount > 1 ? `Strip ${cut.stripLabel} laid` : 'Laid'}
                                tick={ticks.get(tickKey('strip-laid', space.id, cut.stripId))}
                                onToggle={(d) => onTick('strip-laid', cut.stripId, d)}
                                testId={`laid-${cut.stripId}`}
                              />
                            ) : (
                              <span className="self-center text-base text-graphite-light">ticked laid with its last piece</span>
                            )}
                          </div>
                        </li>
                      ))}
                    </ol>
                    {lane.offcutMm > 0 && (
                      <div className="text-base text-graphite-light">
                        Left: {mm(lane.offcutMm)}
                        {lane.offcutKeep === false ? ' (for filling gaps)' : ' (keep for the next strips)'}
                      </div>
                    )}
                  </div>
                ))}
              </div>
            ))}
          </section>
        );
      })}
    </div>
  );
}
