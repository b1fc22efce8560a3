import { createContext, useContext, useId, type ReactNode } from 'react';
import { cn } from '../../lib/cn';

type FieldCtx = { id: string; describedBy?: string; invalid: boolean };
const FieldContext = createContext<FieldCtx | null>(null);

/** The id, aria-describedby and invalid flag of the enclosing Field, for Input/Select/Textarea. */
export function useFieldControl(): FieldCtx | null {
  return useContext(FieldContext);
}

type FieldProps = {
  label: ReactNode;
  error?: string | null;
  hint?: ReactNode;
  required?: boolean;
  className?: string;
  id?: string;
  children: ReactNode;
};

/** A label, its control, a hint and the error that names this field. */
export function Field({ label, error, hint, required, className, id, children }: FieldProps) {
  const autoId = useId();
  const controlId = id ?? `f${autoId.replace(/:/g, '')}`;
  const hintId = hint ? `${controlId}-hint` : undefined;
  const errorId = error ? `${controlId}-error` : undefined;
  const describedBy = [errorId, hintId].filter(Boolean).join(' ') || undefined;
  return (
    <FieldContext.Provider value={{ id: controlId, describedBy, invalid: !!error }}>
      <div className={cn('flex flex-col gap-1', className)}>
        <label htmlFor={controlId} className="text-sm font-medium text-graphite">
          {label}
          {required && (
            <span className="ml-0.5 text-brick" aria-hidden>
              {' '}
              *
            </span>
          )}
        </label>
        {children}
        {hint && !error && (
          <p id={hintId} className="text-xs text-graphite-light">
            {hint}
          </p>
        )}
        {error && (
          <p id={errorId} className="text-xs font-medium text-brick-dark">
            {error}
          </p>
        )}
      </div>
    </FieldContext.Provider>
  );
}
