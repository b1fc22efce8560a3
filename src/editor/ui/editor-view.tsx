import { useMemo, type ReactNode } from 'react';
import type { Takeoff, TakeoffProduct, TakeoffSettings } from '../../../shared/takeoff/compute-takeoff';
import type { TakeoffRun } from '../takeoff/run-takeoff';
import type { Editor } from '../create-editor';
import { PlanStage } from '../canvas/plan-stage';
import { placeMessage, type PlacedIssue } from '../canvas/draw-issues';
import { useEditorState } from '../store/use-editor-state';
import { toDrawnTakeoff } from '../takeoff/to-drawn';
import { useLiveTakeoff } from '../takeoff/use-live-takeoff';
import { UnderlayButton, UnderlayPanel } from './background-controls';
import { CursorReadout, ScaleBar } from './scale-bar';
import { EavesTools } from './eaves-tools';
import { EditorContext } from './editor-context';
import { EditorToolbar } from './editor-toolbar';
import { ExclusionsTools } from './exclusions-tools';
import { HelpSheet } from './help-sheet';
import { JoistsTools } from './joists-tools';
import { LayersTools } from './layers-tools';
import { OutlineTools } from './outline-tools';
import { StepHint, StepsBar } from './steps-bar';
import { TakeoffPanel } from './takeoff-panel';
import { useEditorKeys } from './use-editor-keys';

type Props = {
  editor: Editor;
  products: TakeoffProduct[];
  /** Company settings for the takeoff (the server recomputes with the same). */
  settings?: Partial<TakeoffSettings>;
  /** The page's own toolbar controls (save, revisions, import/export). */
  toolbar?: ReactNode;
  /** The line above the plan name (a link back to the job). */
  crumb?: ReactNode;
  /** Notices over the top of the canvas (draft recovery, save errors): they never push it down. */
  banner?: ReactNode;
  onUploadBackground?: (file: File) => Promise<{ url: string }>;
  /**
   * For a read-only viewer: the takeoff stored with the revision, shown as it is instead of a live
   * one (null when none is stored). Left out, the takeoff is computed live from `products`.
   */
  storedTakeoff?: Takeoff | null;
};

/** The whole editor screen: toolbar, canvas, live takeoff, step tools and the steps bar. */
export function EditorView({ editor, products, settings, toolbar, crumb, banner, onUploadBackground, storedTakeoff }: Props) {
  const plan = useEditorState(editor.store, (s) => s.plan);
  const step = useEditorState(editor.store, (s) => s.session.step);
  const units = useEditorState(editor.store, (s) => s.session.units);
  const error = useEditorState(editor.store, (s) => s.session.error);
  const dragging = useEditorState(editor.store, (s) => s.inGesture);
  const fixed = storedTakeoff !== undefined;
  const live = useLiveTakeoff(plan, products, settings, dragging, !fixed);
  const stored = useMemo<TakeoffRun | null>(() => (fixed ? { takeoff: storedTakeoff, errors: [], warnings: [], elapsedMs: 0 } : null), [fixed, storedTakeoff]);
  const run = fixed ? stored : live;
  useEditorKeys(editor);
  const drawn = useMemo(() => (run?.takeoff ? toDrawnTakeoff(run.takeoff) : null), [run]);
  const issues = useMemo(() => {
    if (!run) return [];
    const out: PlacedIssue[] = [];
    for (const m of run.errors) {
      const p = placeMessage(plan, m, 'error');
      if (p) out.push(p);
    }
    for (const m of run.warnings) {
      const p = placeMessage(plan, m, 'warning');
      if (p) out.push(p);
    }
    return out;
    // Messages belong to the plan they were computed for; placing them on the live plan is what we want.
  }, [run, plan]);

  return (
    <EditorContext.Provider value={editor}>
      <div className="flex h-full min-h-0 flex-col bg-paper" data-testid="plan-editor">
        <EditorToolbar crumb={crumb}>
          {!editor.readOnly && <UnderlayButton onUpload={onUploadBackground} />}
          {toolbar}
        </EditorToolbar>
        <div className="flex min-h-0 flex-1 max-sm:flex-col">
          <div className="relative min-w-0 flex-1 max-sm:h-[60dvh] max-sm:flex-none" data-testid="canvas-area">
            <PlanStage editor={editor} takeoff={drawn} issues={issues} />
            <div className="pointer-events-none absolute inset-x-2 top-2 z-10 flex flex-col items-start gap-2 *:pointer-events-auto">
              {banner}
              {error && (
                <div role="alert" data-testid="editor-error" className="self-center rounded bg-brick px-3 py-1.5 text-sm text-white shadow">
                  {error}
                  <button type="button" className="ml-3 underline" onClick={() => editor.store.setError(null)}>
                    dismiss
                  </button>
                </div>
              )}
              {!editor.readOnly && <UnderlayPanel />}
            </div>
            <div className="pointer-events-none absolute bottom-2 right-2 flex items-end gap-2">
              <ScaleBar />
              <CursorReadout />
            </div>
            <HelpSheet />
          </div>
          <div className="w-80 shrink-0 max-md:w-64 max-sm:h-64 max-sm:w-full max-sm:border-t max-sm:border-graphite/15">
            <TakeoffPanel run={run} units={units} stale={dragging && run?.takeoff != null} />
          </div>
        </div>
        <div className="border-t border-graphite/15 bg-paper px-3 py-2">
          <StepHint />
          <div className="mt-1.5">
            {editor.readOnly && <p className="text-sm text-graphite-light">Read only: you can look around the plan and the takeoff.</p>}
            {editor.readOnly ? null : step === 'outline' && <OutlineTools />}
            {!editor.readOnly && step === 'joists' && <JoistsTools />}
            {!editor.readOnly && step === 'exclusions' && <ExclusionsTools />}
            {!editor.readOnly && step === 'eaves' && <EavesTools companyMode={settings?.eavesMode ?? 'gap'} />}
            {!editor.readOnly && step === 'layers' && <LayersTools products={products} />}
          </div>
        </div>
        <StepsBar />
      </div>
    </EditorContext.Provider>
  );
}
