import { cn } from '../../lib/cn';
import { STEPS, type StepId } from '../store/session';
import { useEditor, useEditorSelect } from './editor-context';

export const STEP_LABELS: Record<StepId, string> = {
  outline: 'Outline',
  joists: 'Joists',
  exclusions: 'Exclusions',
  eaves: 'Eaves',
  layers: 'Layers',
  review: 'Review',
};

export const STEP_HINTS: Record<StepId, string> = {
  outline:
    'Click corners on the grid (hold Alt to draw freely) or type the walls as read off the tape; click a wall to type its length; drag corners, drag a ◦ to add one.',
  joists: 'Click an edge the joists run along, or type the angle; drag a joist to place the first one.',
  exclusions: 'Pick a kind, then click two opposite corners (polygon: click each corner, Enter closes); a downlight is one click; drag the paper to pan.',
  eaves: 'Click each edge where the roof meets the wall plate; the blue band is kept clear for air.',
  layers: 'Record what is there now and the target; the strips show in straw (between joists) and teal (across).',
  review: 'Check the takeoff on the right, its site checks and the cautions before saving; go back to any step to change it.',
};

/** The guided steps along the bottom edge; any step can be revisited. */
export function StepsBar() {
  const editor = useEditor();
  const step = useEditorSelect((s) => s.session.step);
  return (
    <nav aria-label="Editor steps" className="flex items-stretch gap-1 border-t border-graphite/15 bg-paper-dark/80 px-2 py-1.5">
      {STEPS.map((s, i) => (
        <button
          key={s}
          type="button"
          data-testid={`step-${s}`}
          aria-current={s === step ? 'step' : undefined}
          onClick={() => editor.setStep(s)}
          className={cn(
            'flex min-w-0 flex-1 items-center justify-center gap-1.5 rounded px-2 py-1.5 text-sm',
            s === step ? 'bg-graphite text-paper' : 'text-graphite hover:bg-white/70',
          )}
        >
          <span className={cn('font-mono text-xs', s === step ? 'text-straw' : 'text-graphite-faint')}>{i + 1}</span>
          <span className="truncate">{STEP_LABELS[s]}</span>
        </button>
      ))}
    </nav>
  );
}

/** The one-line hint of the current step. */
export function StepHint() {
  const step = useEditorSelect((s) => s.session.step);
  return (
    <p className="truncate text-sm text-graphite-light" data-testid="step-hint">
      {STEP_HINTS[step]}
    </p>
  );
}
