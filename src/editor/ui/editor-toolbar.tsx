import type { ReactNode } from 'react';
import { useEditor, useEditorSelect } from './editor-context';

const btn = 'h-8 min-w-8 shrink-0 rounded border border-graphite/25 bg-white px-2 text-sm disabled:opacity-40';

type Props = {
  /** A line above the plan name (the page's breadcrumb back to the job). */
  crumb?: ReactNode;
  /** The page's own controls (save, revisions, import/export), kept at the right. */
  children?: ReactNode;
};

/**
 * Undo/redo, zoom and fit, units, help, then the page's controls. One row that never wraps from
 * 1024 px up: the title block shrinks (and truncates) instead, so nothing below it moves when a
 * label changes. Narrower screens (an upright tablet, a phone) get a wrapping toolbar: in one row
 * the save status and Save ran off an 820 px screen.
 */
export function EditorToolbar({ crumb, children }: Props) {
  const editor = useEditor();
  const canUndo = useEditorSelect((s) => s.undoStack.length > 0);
  const canRedo = useEditorSelect((s) => s.redoStack.length > 0);
  const units = useEditorSelect((s) => s.session.units);
  const name = useEditorSelect((s) => s.plan.name);
  return (
    <div
      className="flex h-12 shrink-0 flex-nowrap items-center gap-2 border-b border-graphite/15 bg-paper-dark/60 px-3 max-lg:h-auto max-lg:flex-wrap max-lg:py-1.5"
      data-testid="editor-toolbar"
    >
      <div className="mr-1 min-w-0 flex-1 leading-tight max-lg:basis-full">
        {crumb && <div className="truncate text-xs text-graphite-light">{crumb}</div>}
        <h1 className="truncate text-sm font-semibold" data-testid="plan-name" title={name}>
          {name}
        </h1>
      </div>
      {!editor.readOnly && (
        <>
          <button type="button" className={btn} disabled={!canUndo} onClick={() => editor.undo()} title="Undo (Ctrl+Z)" aria-label="Undo" data-testid="undo">
            ↶<span className="max-xl:hidden"> Undo</span>
          </button>
          <button
            type="button"
            className={btn}
            disabled={!canRedo}
            onClick={() => editor.redo()}
            title="Redo (Ctrl+Shift+Z)"
            aria-label="Redo"
            data-testid="redo"
          >
            ↷<span className="max-xl:hidden"> Redo</span>
          </button>
          <span className="mx-0.5 h-5 w-px shrink-0 bg-graphite/20" />
        </>
      )}
      <button type="button" className={btn} onClick={() => editor.zoomBy(0.8)} title="Zoom out (−)" aria-label="Zoom out">
        −
      </button>
      <button type="button" className={btn} onClick={() => editor.zoomBy(1.25)} title="Zoom in (+)" aria-label="Zoom in">
        +
      </button>
      <button type="button" className={btn} onClick={() => editor.fit()} title="Fit (F)" data-testid="fit">
        Fit
      </button>
      <select
        className="h-8 shrink-0 rounded border border-graphite/25 bg-white px-1 text-sm"
        value={units}
        aria-label="Units"
        onChange={(e) => editor.store.setSession({ units: e.target.value as 'metric' | 'imperial' })}
      >
        <option value="metric">mm, m²</option>
        <option value="imperial">ft-in, ft²</option>
      </select>
      <button
        type="button"
        className={btn}
        onClick={() => editor.store.setSession((s) => ({ helpOpen: !s.helpOpen }))}
        title="Shortcuts (?)"
        aria-label="Shortcuts"
      >
        ?
      </button>
      {/* When wrapping, the page's controls take a line of their own and wrap there too. */}
      <div className="ml-auto flex shrink-0 flex-nowrap items-center gap-2 max-lg:ml-0 max-lg:min-w-0 max-lg:shrink max-lg:basis-full max-lg:flex-wrap">
        {children}
      </div>
    </div>
  );
}
