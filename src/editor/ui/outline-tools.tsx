import { useMemo, useState } from 'react';
import { cmd, deleteCorner, describeDirection, parseRun, closeOutlineFromRun, setEdgeLength, setEdgeLengthDetailed, setOutline } from '../commands';
import { formatLength } from '../geometry/units';
import { useEditor, useEditorSelect } from './editor-context';
import { NumberField } from './number-field';

/** Outline step: type a run of walls, change a selected edge's length, delete a corner, start again. */
export function OutlineTools() {
  const editor = useEditor();
  const plan = useEditorSelect((s) => s.plan);
  const sel = useEditorSelect((s) => s.session.selection);
  const units = useEditorSelect((s) => s.session.units);
  const [run, setRun] = useState('');
  const preview = useMemo(() => {
    if (!run.trim()) return null;
    try {
      const r = parseRun(run);
      return r.closure.kind === 'closed'
        ? { ok: true, text: `${r.points.length} corners; closes with ${r.closure.errorMm} mm closing error` }
        : {
            ok: true,
            text: `${r.points.length} corners; closing error ${formatLength(r.closure.lengthMm, units)} — a last wall of that length ${describeDirection(r.closure.angleDeg)} closes it`,
          };
    } catch (e) {
      return { ok: false, text: (e as Error).message };
    }
  }, [run, units]);
  const apply = () => {
    if (editor.store.dispatch(cmd('typed walls', closeOutlineFromRun, { text: run }))) {
      setRun('');
      editor.fit();
    }
  };
  const edge = sel?.kind === 'edge' && sel.index < plan.outline.length ? sel.index : null;
  const edgeLen =
    edge !== null
      ? (() => {
          const a = plan.outline[edge],
            b = plan.outline[(edge + 1) % plan.outline.length];
          return Math.round(Math.hypot(b[0] - a[0], b[1] - a[1]));
        })()
      : 0;
  // Whether typing a length here keeps the other walls' directions (see setEdgeLength).
  const keepsSquare = useMemo(() => {
    if (edge === null) return true;
    try {
      return setEdgeLengthDetailed(plan, { edge, lengthMm: edgeLen + 1 }).keptSquare;
    } catch {
      return true;
    }
  }, [plan, edge, edgeLen]);
  return (
    <div className="flex flex-wrap items-end gap-3">
      <form
        className="flex min-w-[280px] flex-1 flex-col gap-0.5"
        onSubmit={(e) => {
          e.preventDefault();
          apply();
        }}
      >
        <label className="text-xs text-graphite-light" htmlFor="wall-run">
          Walls in order (e.g. 4200 right, 3600 down, 4200 left)
        </label>
        <div className="flex gap-2">
          <input
            id="wall-run"
            data-testid="wall-run"
            className="h-8 min-w-0 flex-1 rounded border border-graphite/25 bg-white px-2 font-mono text-sm"
            value={run}
            placeholder="4200 R, 3600 D, 4200 L, 3600 U"
            onChange={(e) => setRun(e.target.value)}
            onKeyDown={(e) => e.stopPropagation()}
          />
          <button
            type="submit"
            data-testid="wall-run-apply"
            disabled={!preview?.ok}
            className="h-8 rounded bg-teal-dark px-3 text-sm text-white disabled:opacity-50"
          >
            Use walls
          </button>
        </div>
        {preview && (
          <span data-testid="wall-run-preview" className={preview.ok ? 'text-xs text-teal-dark' : 'text-xs text-brick'}>
            {preview.text}
          </span>
        )}
      </form>
      {edge !== null && (
        <NumberField
          key={edge}
          label={`Edge ${edge + 1} length`}
          unit="mm"
          value={edgeLen}
          testId="edge-length"
          onCommit={(v) => editor.store.dispatch(cmd(`edge ${edge + 1} length`, setEdgeLength, { edge, lengthMm: v }))}
          className="w-32"
        />
      )}
      {edge !== null && (
        <p className="max-w-56 text-xs text-graphite-light" data-testid="edge-length-note">
          {keepsSquare
            ? 'A new length moves the walls after it along, so every wall keeps its direction.'
            : 'No other wall is parallel to this one: a new length moves its end corner, and the next wall turns to meet it.'}
        </p>
      )}
      {sel?.kind === 'corner' && sel.index < plan.outline.length && (
        <button
          type="button"
          className="h-8 rounded border border-graphite/25 px-3 text-sm"
          onClick={() => {
            editor.store.dispatch(cmd(`delete corner ${sel.index + 1}`, deleteCorner, { index: sel.index }));
            editor.store.setSession({ selection: null });
          }}
        >
          Delete corner {sel.index + 1}
        </button>
      )}
      {plan.outline.length > 0 && (
        <button
          type="button"
          className="h-8 rounded border border-graphite/25 px-3 text-sm"
          onClick={() => {
            editor.store.dispatch(cmd('clear outline', setOutline, { outline: [] }));
            editor.store.setSession({ selection: null });
          }}
        >
          Draw again
        </button>
      )}
    </div>
  );
}
