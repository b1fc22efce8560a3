import { useEffect, useMemo, useRef, useState } from 'react';
import { Layer, Shape, Stage } from 'react-konva';
import type { Context } from 'konva/lib/Context';
import type { Plan } from '../../../shared/plan/plan-schema';
import type { Editor } from '../create-editor';
import type { Session } from '../store/session';
import { useEditorState } from '../store/use-editor-state';
import type { DrawContext } from './draw-context';
import { drawDraft } from './draw-draft';
import { drawEaves } from './draw-eaves';
import { drawExclusions } from './draw-exclusions';
import { drawHandles } from './draw-handles';
import { drawJoists } from './draw-joists';
import { drawOutline } from './draw-outline';
import { drawPaper } from './draw-paper';
import { drawLayArrows, drawStrips, type DrawnTakeoff } from './draw-strips';
import { drawIssues, type PlacedIssue } from './draw-issues';
import { BackgroundImage } from './background-image';
import { usePointerInput } from './use-pointer-input';

type Props = { editor: Editor; takeoff: DrawnTakeoff | null; issues: PlacedIssue[] };

/**
 * The plan drawn with react-konva. Konva only draws: every shape takes the plan, camera and
 * session as input; pointer events go to the editor's tools as screen pixels, never read back
 * from Konva nodes.
 */
export function PlanStage({ editor, takeoff, issues }: Props) {
  const { store } = editor;
  const plan = useEditorState(store, (s) => s.plan);
  const session = useEditorState(store, (s) => s.session);
  const wrap = useRef<HTMLDivElement>(null);
  const [size, setSize] = useState({ width: 0, height: 0 });
  const handlers = usePointerInput(editor, wrap);

  useEffect(() => {
    const el = wrap.current;
    if (!el) return;
    const ro = new ResizeObserver(() => {
      const r = el.getBoundingClientRect();
      setSize({ width: Math.floor(r.width), height: Math.floor(r.height) });
      editor.setViewport(Math.floor(r.width), Math.floor(r.height));
    });
    ro.observe(el);
    return () => ro.disconnect();
  }, [editor]);

  const cam = session.camera;
  const draw = (fn: (d: DrawContext) => void) => (kctx: Context) => {
    fn({ ctx: kctx._context as CanvasRenderingContext2D, cam, width: size.width, height: size.height });
  };
  // Same function while camera and size stay, so react-konva leaves the paper layer alone.
  const paperFunc = useMemo(
    () => (kctx: Context) => drawPaper({ ctx: kctx._context as CanvasRenderingContext2D, cam, width: size.width, height: size.height }),
    [cam, size.width, size.height],
  );
  const selEdge = session.selection?.kind === 'edge' ? session.selection.index : null;
  const selExcl = session.selection?.kind === 'exclusion' ? session.selection.index : null;
  const showStrips = session.step === 'layers' || session.step === 'review';

  return (
    <div
      ref={wrap}
      className="relative h-full w-full touch-none select-none overflow-hidden outline-none"
      // Its own compositing layer, contained: redrawing the canvas then repaints only the canvas,
      // not the takeoff panel's text beside it (which matters without GPU raster).
      style={{ cursor: cursorFor(editor, session), willChange: 'transform', contain: 'strict' }}
      // Focusable so the editor's keyboard shortcuts reach it; an application region to screen readers.
      role="application"
      aria-label="Plan drawing"
      tabIndex={0}
      data-testid="plan-canvas"
      {...handlers}
    >
      {size.width > 0 && (
        <Stage width={size.width} height={size.height} listening={false}>
          {/* Paper and underlay change only with the camera: their own layer is not redrawn by a drag. */}
          <Layer listening={false}>
            <Shape sceneFunc={paperFunc} perfectDrawEnabled={false} />
            {plan.background && <BackgroundImage background={plan.background} camera={cam} />}
          </Layer>
          <Layer listening={false}>
            <Shape sceneFunc={draw((d) => drawLoft(d, plan, session, takeoff, showStrips, selExcl))} perfectDrawEnabled={false} />
            <Shape sceneFunc={draw((d) => drawOutline(d, plan, session.units, selEdge))} perfectDrawEnabled={false} />
            <Shape
              sceneFunc={draw((d) => {
                drawIssues(d, issues);
                if (showStrips && takeoff) drawLayArrows(d, takeoff);
              })}
              perfectDrawEnabled={false}
            />
            <Shape
              sceneFunc={draw((d) => {
                drawHandles(d, plan, session);
                drawDraft(d, plan, session);
              })}
              perfectDrawEnabled={false}
            />
          </Layer>
        </Stage>
      )}
    </div>
  );
}

function drawLoft(d: DrawContext, plan: Plan, session: Session, takeoff: DrawnTakeoff | null, showStrips: boolean, selExcl: number | null) {
  if (showStrips && takeoff) drawStrips(d, takeoff, session.step === 'review');
  drawEaves(d, plan);
  drawJoists(d, plan, session.step === 'joists');
  drawExclusions(d, plan, selExcl);
}

function cursorFor(editor: Editor, session: Session): string {
  const st = editor.toolState();
  if (st.startsWith('dragging') || st === 'panning') return 'grabbing';
  if (session.step === 'outline' || session.step === 'exclusions' || editor.isCalibrating()) return 'crosshair';
  return 'default';
}
