import { useState } from 'react';
import { cn } from '../../lib/cn';
import { useEditor } from './editor-context';

type Props = {
  label: string;
  value: number;
  unit?: string;
  step?: number;
  min?: number;
  max?: number;
  /**
   * Called once when the user commits (Enter or leaving the field), so one edit = one undo step.
   * Returns false when the plan refused the value (the dispatch's answer).
   */
  onCommit: (v: number) => boolean | void;
  testId?: string;
  className?: string;
};

/**
 * A number that commits on Enter or blur; Escape puts the current value back. A value the plan
 * refuses never stays in the field looking accepted: the field goes back to the plan's value and
 * says why under it, naming itself, until the next edit.
 */
export function NumberField({ label, value, unit, step, min, max, onCommit, testId, className }: Props) {
  const editor = useEditor();
  const [text, setText] = useState(String(value));
  const [error, setError] = useState<string | null>(null);
  // A new value from outside (undo, another field) replaces the text, during render not in an effect.
  const [shown, setShown] = useState(value);
  if (shown !== value) {
    setShown(value);
    setText(String(value));
    setError(null);
  }
  const refuse = (why: string) => {
    setText(String(value));
    setError(`${label}: ${why}`);
  };
  const commit = () => {
    const typed = text.trim();
    const v = Number(typed.replace(',', '.'));
    if (typed === '') return setText(String(value));
    if (!Number.isFinite(v)) return refuse(`“${typed}” is not a number`);
    if (v === value) return;
    if (onCommit(v) === false) {
      // The store holds the command's refusal; show it here instead of in the canvas alert.
      const why = editor.store.getState().session.error ?? 'not accepted';
      editor.store.setError(null);
      refuse(`${why}; kept ${value}${unit ? ` ${unit}` : ''}`);
    }
  };
  const errorId = testId ? `${testId}-error` : undefined;
  return (
    <label className={cn('relative flex flex-col gap-0.5 text-xs text-graphite-light', className)}>
      <span>{label}</span>
      <span className="flex items-center gap-1">
        <input
          type="text"
          inputMode="decimal"
          className={cn(
            'h-8 w-full min-w-0 rounded border bg-white px-2 font-mono text-sm text-graphite focus:outline-2 focus:outline-teal',
            error ? 'border-brick' : 'border-graphite/25',
          )}
          value={text}
          step={step}
          min={min}
          max={max}
          data-testid={testId}
          aria-invalid={error ? true : undefined}
          aria-describedby={error ? errorId : undefined}
          onChange={(e) => {
            setText(e.target.value);
            setError(null);
          }}
          onBlur={commit}
          onKeyDown={(e) => {
            if (e.key === 'Enter') commit();
            if (e.key === 'Escape') {
              setText(String(value));
              setError(null);
            }
            e.stopPropagation();
          }}
        />
        {unit && <span className="font-mono text-xs">{unit}</span>}
      </span>
      {error && (
        <span
          role="alert"
          id={errorId}
          data-testid={errorId}
          className="absolute bottom-full left-0 z-20 mb-1 w-72 rounded bg-brick px-2 py-1 text-xs text-white shadow"
        >
          {error}
        </span>
      )}
    </label>
  );
}
