import { useState } from 'react';
import { cn } from '../../lib/cn';

type Props = {
  label: string;
  value: number;
  unit?: string;
  step?: number;
  min?: number;
  max?: number;
  /** Called once when the user commits (Enter or leaving the field), so one edit = one undo step. */
  onCommit: (v: number) => void;
  testId?: string;
  className?: string;
};

/** A number that commits on Enter or blur; Escape puts the current value back. */
export function NumberField({ label, value, unit, step, min, max, onCommit, testId, className }: Props) {
  const [text, setText] = useState(String(value));
  // A new value from outside (undo, another field) replaces the text, during render not in an effect.
  const [shown, setShown] = useState(value);
  if (shown !== value) {
    setShown(value);
    setText(String(value));
  }
  const commit = () => {
    const v = Number(text.replace(',', '.'));
    if (text.trim() === '' || !Number.isFinite(v)) return setText(String(value));
    if (v !== value) onCommit(v);
  };
  return (
    <label className={cn('flex flex-col gap-0.5 text-xs text-graphite-light', className)}>
      <span>{label}</span>
      <span className="flex items-center gap-1">
        <input
          type="number"
          inputMode="decimal"
          className="h-8 w-full min-w-0 rounded border border-graphite/25 bg-white px-2 font-mono text-sm text-graphite focus:outline-2 focus:outline-teal"
          value={text}
          step={step}
          min={min}
          max={max}
          data-testid={testId}
          onChange={(e) => setText(e.target.value)}
          onBlur={commit}
          onKeyDown={(e) => {
            if (e.key === 'Enter') commit();
            if (e.key === 'Escape') setText(String(value));
            e.stopPropagation();
          }}
        />
        {unit && <span className="font-mono text-xs">{unit}</span>}
      </span>
    </label>
  );
}
