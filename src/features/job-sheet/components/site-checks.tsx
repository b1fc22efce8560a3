import { useState } from 'react';
import type { SheetCheck, SheetSpace } from '../../../../shared/api/job-sheet';
import { tickKey, type ShownTick } from '../merge-pending';
import { TickButton, tickedByLine } from './tick-button';

type Props = {
  space: SheetSpace;
  ticks: Map<string, ShownTick>;
  onCheck: (code: string, done: boolean, reason: string) => void;
};

function CheckRow({ spaceId, check, tick, onCheck }: { spaceId: string; check: SheetCheck; tick: ShownTick | undefined; onCheck: Props['onCheck'] }) {
  const [writing, setWriting] = useState(false);
  const [reason, setReason] = useState(tick?.reason ?? '');
  const fieldId = `reason-${spaceId}-${check.code}`;
  return (
    <li className="rounded-md border-2 border-graphite/25 bg-white p-3" data-testid={`check-${check.code}`}>
      <div className="text-lg font-bold leading-snug">{check.title}</div>
      <p className="mt-1 text-base leading-snug text-graphite">{check.detail}</p>
      <div className="mt-2">
        <TickButton label="Done" tick={tick} onToggle={(d) => onCheck(check.code, d, '')} testId={`tick-${check.code}`} />
      </div>
      {tick && (tick.done || tick.reason) && <p className="mt-2 text-sm font-medium text-teal-dark">{tickedByLine(tick)}</p>}
      {!tick?.done && tick?.reason && !writing && <p className="mt-1 text-base">Not done: {tick.reason}</p>}
      {!tick?.done &&
        (writing ? (
          <div className="mt-2">
            <label htmlFor={fieldId} className="block text-base font-semibold">
              Why can it not be done?
            </label>
            <textarea
              id={fieldId}
              value={reason}
              onChange={(e) => setReason(e.target.value)}
              rows={2}
              className="mt-1 w-full rounded-md border-2 border-graphite/40 p-2 text-base"
            />
            <div className="mt-2 flex gap-2">
              <button
                type="button"
                className="min-h-11 rounded-md bg-graphite px-4 text-base font-bold text-white disabled:opacity-50"
                disabled={!reason.trim()}
                onClick={() => {
                  onCheck(check.code, false, reason.trim());
                  setWriting(false);
                }}
              >
                Save reason
              </button>
              <button type="button" className="min-h-11 rounded-md border-2 border-graphite/40 px-4 text-base" onClick={() => setWriting(false)}>
                Cancel
              </button>
            </div>
          </div>
        ) : (
          <button type="button" className="mt-2 text-base font-semibold text-brick-dark underline" onClick={() => setWriting(true)}>
            {tick?.reason ? 'Change the reason' : 'Cannot be done? Give a reason'}
          </button>
        ))}
    </li>
  );
}

/** The site checks one space's plan raises; each ticked with time and user, or given a written reason. */
export function SiteChecks({ space, ticks, onCheck }: Props) {
  if (space.checks.length === 0) return <p className="text-base text-graphite-light">No site checks raised for this space.</p>;
  return (
    <ul className="flex flex-col gap-3">
      {space.checks.map((c) => (
        <CheckRow key={c.code} spaceId={space.id} check={c} tick={ticks.get(tickKey('check', space.id, c.code))} onCheck={onCheck} />
      ))}
    </ul>
  );
}
