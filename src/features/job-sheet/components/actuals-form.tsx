import type { ActualsBody } from '../../../../shared/api/actuals';
import type { VanLoad } from '../../../../shared/api/job-sheet';
import type { ActualsPart } from '../../../../shared/api/settings';

/** The form's own state: text as typed, so a field can be empty while the installer types. */
export type ActualsDraft = {
  rolls: Record<string, { used: string; returned: string }>;
  hours: Record<string, string>;
  extras: Record<string, string>;
};

/** Prefilled from the van load: every roll taken was used, none came back; extras as listed; hours left to fill in. */
export function draftFromVanLoad(load: VanLoad, people: { id: string }[]): ActualsDraft {
  return {
    rolls: Object.fromEntries(load.rolls.map((r) => [r.productId, { used: String(r.count), returned: '0' }])),
    hours: Object.fromEntries(people.map((p) => [p.id, ''])),
    extras: Object.fromEntries(load.extras.map((x) => [x.code, String(x.quantity)])),
  };
}

const num = (s: string) => (s.trim() === '' ? null : Number(s.replace(',', '.')));

/** The body's `actuals` from the draft: blank fields are left out, so only what was entered is sent. */
export function actualsFromDraft(d: ActualsDraft): ActualsBody {
  return {
    rolls: Object.entries(d.rolls).flatMap(([productId, r]) =>
      num(r.used) === null ? [] : [{ productId, used: num(r.used)!, returned: num(r.returned) ?? 0 }],
    ),
    hours: Object.entries(d.hours).flatMap(([userId, h]) => (num(h) === null ? [] : [{ userId, hours: num(h)! }])),
    extras: Object.entries(d.extras).flatMap(([code, x]) => (num(x) === null ? [] : [{ code: code as never, used: num(x)! }])),
  };
}

/**
 * The parts the company asks for that this job has fields for (no extras in the van load: none to
 * ask), as the server judges them on finishing.
 */
export function askedParts(asked: readonly ActualsPart[] | undefined, load: VanLoad, people: readonly unknown[]): ActualsPart[] {
  const has: Record<ActualsPart, boolean> = { rolls: load.rolls.length > 0, hours: people.length > 0, extras: load.extras.length > 0 };
  return (asked ?? []).filter((p) => has[p]);
}

/** The asked parts the draft leaves empty (every field of that part blank). */
export function missingParts(asked: readonly ActualsPart[], d: ActualsDraft): ActualsPart[] {
  const body = actualsFromDraft(d);
  return asked.filter((p) => (body[p] ?? []).length === 0);
}

export const PART_TEXT: Record<ActualsPart, string> = { rolls: 'the rolls used', hours: 'the hours on site', extras: 'the extras used' };

const input = 'h-12 w-20 rounded-md border-2 border-graphite/40 bg-white px-2 text-right font-mono text-lg aria-[invalid=true]:border-brick-dark';
const mark = (on: boolean) => (on ? <span className="ml-1 text-sm font-semibold text-brick-dark">(required)</span> : null);

/** What really went in: rolls used and brought back unopened per product, hours on site per installer, extras used. */
export function ActualsForm({
  load,
  people,
  draft,
  onChange,
  required = [],
  hint = 'Filled in from the van load: change what was different.',
  countLabel = 'taken',
}: {
  load: VanLoad;
  people: { id: string; name: string }[];
  draft: ActualsDraft;
  onChange: (d: ActualsDraft) => void;
  /** The parts the company asks for (see askedParts): marked, and flagged while empty. */
  required?: readonly ActualsPart[];
  hint?: string;
  /** What the count beside each product is: rolls taken in the van, or estimated. */
  countLabel?: string;
}) {
  const missing = new Set(missingParts(required, draft));
  const req = (p: ActualsPart) => ({ 'aria-required': required.includes(p), 'aria-invalid': missing.has(p) });
  return (
    <fieldset className="mb-3 rounded-md border-2 border-graphite/20 bg-white/70 p-3">
      <legend className="px-1 text-base font-semibold">What was used</legend>
      <p className="mb-2 text-sm text-graphite-light">{hint} Used = opened and laid; back = unopened rolls returned.</p>
      {load.rolls.map((r) => (
        <div key={r.productId} className="mb-2 border-b border-graphite/10 pb-2">
          <div className="text-base">
            {r.productName}{' '}
            <span className="text-graphite-light">
              ({r.count} {countLabel})
            </span>
            {mark(required.includes('rolls'))}
          </div>
          <div className="mt-1 flex gap-4">
            {(['used', 'returned'] as const).map((f) => (
              <label key={f} className="flex items-center gap-2 text-base">
                {f === 'used' ? 'Used' : 'Back'}
                <input
                  inputMode="numeric"
                  aria-label={`${r.productName}: rolls ${f === 'used' ? 'used' : 'brought back'}`}
                  {...(f === 'used' ? req('rolls') : {})}
                  className={input}
                  value={draft.rolls[r.productId]?.[f] ?? ''}
                  onChange={(e) => onChange({ ...draft, rolls: { ...draft.rolls, [r.productId]: { ...draft.rolls[r.productId], [f]: e.target.value } } })}
                />
              </label>
            ))}
          </div>
        </div>
      ))}
      {people.map((p) => (
        <label key={p.id} className="mb-2 flex items-center justify-between gap-2 text-base">
          <span>
            {p.name}: hours on site{mark(required.includes('hours'))}
          </span>
          <input
            inputMode="decimal"
            aria-label={`${p.name}: hours on site`}
            {...req('hours')}
            className={input}
            value={draft.hours[p.id] ?? ''}
            onChange={(e) => onChange({ ...draft, hours: { ...draft.hours, [p.id]: e.target.value } })}
          />
        </label>
      ))}
      {load.extras.map((x) => (
        <label key={x.code} className="mb-2 flex items-center justify-between gap-2 text-base">
          <span>
            {x.label} {x.unit && <span className="text-graphite-light">({x.unit})</span>}
            {mark(required.includes('extras'))}
          </span>
          <input
            inputMode="decimal"
            aria-label={`${x.label}: used`}
            {...req('extras')}
            className={input}
            value={draft.extras[x.code] ?? ''}
            onChange={(e) => onChange({ ...draft, extras: { ...draft.extras, [x.code]: e.target.value } })}
          />
        </label>
      ))}
    </fieldset>
  );
}
