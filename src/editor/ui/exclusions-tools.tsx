import { EXCLUSION_KINDS, type ExclusionKind } from '../../../shared/plan/plan-schema';
import { KIND_STYLES } from '../canvas/palette';
import { cmd, deleteExclusion, setBoards, setExclusionKind, setExclusionLabel } from '../commands';
import { cn } from '../../lib/cn';
import { useEditor, useEditorSelect } from './editor-context';
import { KindSwatch } from './exclusion-legend';
import { addExclusionAtViewCentre } from '../keyboard-moves';

/** What each kind asks of the installer (the app's words); shown when one is selected. */
export const KIND_RULES: Record<ExclusionKind, string> = {
  hatch: 'Insulate and draught-seal the hatch lid; finish the laying here.',
  tank: 'Never insulate beneath a cold water tank; lag the tank and its pipes.',
  chimney: 'Keep the clearance to the chimney (Approved Document J and the appliance maker).',
  flue: 'Keep the clearance to the flue (Approved Document J and the appliance maker).',
  boarded: 'Raise the boards on a deck over the insulation, or leave the area; never compress it.',
  downlight: 'Fit a fire-rated cover over the downlight before insulating around it.',
  other: 'Leave the area clear; note why in its label.',
};

/** Exclusions step: the kind to draw, rectangle or polygon, and the selected exclusion's details. */
export function ExclusionsTools() {
  const editor = useEditor();
  const kind = useEditorSelect((s) => s.session.exclusionKind);
  const shape = useEditorSelect((s) => s.session.exclusionShape);
  const sel = useEditorSelect((s) => s.session.selection);
  const exclusions = useEditorSelect((s) => s.plan.exclusions);
  const i = sel?.kind === 'exclusion' && sel.index < exclusions.length ? sel.index : null;
  const ex = i !== null ? exclusions[i] : null;
  return (
    <div className="flex flex-wrap items-end gap-3">
      <div className="flex flex-wrap gap-1" role="radiogroup" aria-label="Kind to draw">
        {EXCLUSION_KINDS.map((k) => (
          <button
            key={k}
            type="button"
            role="radio"
            aria-checked={k === kind}
            data-testid={`kind-${k}`}
            onClick={() => editor.store.setSession({ exclusionKind: k })}
            className={cn(
              'flex h-8 items-center gap-1 rounded border px-2 text-sm',
              k === kind ? 'border-brick bg-brick-light/60' : 'border-graphite/25 bg-white',
            )}
          >
            <KindSwatch kind={k} size={14} />
            {KIND_STYLES[k].name}
          </button>
        ))}
      </div>
      <button
        type="button"
        data-testid="add-exclusion-at-centre"
        onClick={() => addExclusionAtViewCentre(editor.store)}
        className="h-8 rounded border border-graphite/25 bg-white px-2 text-sm"
        title="Places one in the middle of the view; move it with the arrow keys"
      >
        Add at view centre
      </button>
      {kind !== 'downlight' && (
        <div className="flex gap-1 text-sm">
          {(['rect', 'polygon'] as const).map((s) => (
            <button
              key={s}
              type="button"
              onClick={() => editor.store.setSession({ exclusionShape: s })}
              className={cn('h-8 rounded border px-2', s === shape ? 'border-graphite bg-graphite text-paper' : 'border-graphite/25 bg-white')}
            >
              {s === 'rect' ? 'Rectangle' : 'Polygon'}
            </button>
          ))}
        </div>
      )}
      {ex && i !== null && (
        <div className="flex flex-wrap items-end gap-2 rounded border border-brick/30 bg-white/60 px-2 py-1">
          <label className="flex flex-col text-xs text-graphite-light">
            Label
            <input
              key={i}
              defaultValue={ex.label ?? ''}
              data-testid="exclusion-label"
              className="h-8 w-40 rounded border border-graphite/25 bg-white px-2 text-sm text-graphite"
              onKeyDown={(e) => {
                e.stopPropagation();
                if (e.key === 'Enter') (e.target as HTMLInputElement).blur();
              }}
              onBlur={(e) => {
                if ((ex.label ?? '') !== e.target.value.trim()) editor.store.dispatch(cmd('label', setExclusionLabel, { index: i, label: e.target.value }));
              }}
            />
          </label>
          <label className="flex flex-col text-xs text-graphite-light">
            Kind
            <select
              value={ex.kind}
              className="h-8 rounded border border-graphite/25 bg-white px-1 text-sm text-graphite"
              onChange={(e) => editor.store.dispatch(cmd('kind', setExclusionKind, { index: i, kind: e.target.value as ExclusionKind }))}
            >
              {EXCLUSION_KINDS.map((k) => (
                <option key={k} value={k}>
                  {KIND_STYLES[k].name}
                </option>
              ))}
            </select>
          </label>
          {ex.kind === 'boarded' && (
            <label className="flex flex-col text-xs text-graphite-light">
              Boards
              <select
                value={ex.boards ?? 'leave'}
                data-testid="exclusion-boards"
                className="h-8 rounded border border-graphite/25 bg-white px-1 text-sm text-graphite"
                onChange={(e) => editor.store.dispatch(cmd('boards', setBoards, { index: i, boards: e.target.value as 'raise' | 'leave' }))}
              >
                <option value="leave">leave boarded</option>
                <option value="raise">raise and insulate under</option>
              </select>
            </label>
          )}
          <button
            type="button"
            className="h-8 rounded bg-brick px-2 text-sm text-white"
            onClick={() => {
              editor.store.dispatch(cmd(`delete ${ex.kind}`, deleteExclusion, { index: i }));
              editor.store.setSession({ selection: null });
            }}
          >
            Delete
          </button>
          <p className="max-w-xs text-xs text-graphite-light">{KIND_RULES[ex.kind]}</p>
        </div>
      )}
    </div>
  );
}
