import type { ReactNode } from 'react';
import { useEditor, useEditorSelect } from './editor-context';

const btn = 'h-8 min-w-8 rounded border border-graphite/25 bg-white px-2 text-sm disabled:opacity-40';

/** Undo/redo, zoom and fit, units, help; `children` adds the page's own controls (save…). */
export function EditorToolbar({ children }: { children?: ReactNode }) {
  const editor = useEditor();
  const canUndo = useEditorSelect((s) => s.undoStack.length > 0);
  const canRedo = useEditorSelect((s) => s.redoStack.length > 0);
  const units = useEditorSelect((s) => s.session.units);
  const name = useEditorSelect((s) => s.plan.name);
  return (
    <div className="flex flex-wrap items-center gap-2 border-b border-graphite/15 bg-paper-dark/60 px-3 py-1.5">
      <h1 className="mr-2 truncate font-semibold" data-testid="plan-name">
        {name}
      </h1>
      {!editor.readOnly && (
        <>
          <button type="button" className={btn} disabled={!canUndo} onClick={() => editor.undo()} title="Undo (Ctrl+Z)" data-testid="undo">
            ↶ Undo
          </button>
          <button type="button" className={btn} disabled={!canRedo} onClick={() => editor.redo()} title="Redo (Ctrl+Shift+Z)" data-testid="redo">
            ↷ Redo
          </button>
          <span className="mx-1 h-5 w-px bg-graphite/20" />
        </>
      )}
      <button type="button" className={btn} onClick={() => editor.zoomBy(0.8)} title="Zoom out (−)">
        −
      </button>
      <button type="button" className={btn} onClick={() => editor.zoomBy(1.25)} title="Zoom in (+)">
        +
      </button>
      <button type="button" className={btn} onClick={() => editor.fit()} title="Fit (F)" data-testid="fit">
        Fit
      </button>
      <select
        className="h-8 rounded border border-graphite/25 bg-white px-1 text-sm"
        value={units}
        aria-label="Units"
        onChange={(e) => editor.store.setSession({ units: e.target.value as 'metric' | 'imperial' })}
      >
        <option value="metric">mm, m²</option>
        <option value="imperial">ft-in, ft²</option>
      </select>
      <button type="button" className={btn} onClick={() => editor.store.setSession((s) => ({ helpOpen: !s.helpOpen }))} title="Shortcuts (?)">
        ?
      </button>
      <div className="ml-auto flex flex-wrap items-center gap-2">{children}</div>
    </div>
  );
}
