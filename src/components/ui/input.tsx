import { forwardRef, type InputHTMLAttributes, type TextareaHTMLAttributes } from 'react';
import { cn } from '../../lib/cn';
import { useFieldControl } from './field';

/**
 * The base look of a text control. Width and height are added by `sizeClasses` so a caller's
 * `w-40` or `h-9` replaces the default instead of fighting it in the cascade.
 */
export const controlClass =
  'rounded-md border bg-white/85 px-3 text-[15px] text-graphite placeholder:text-graphite-faint shadow-[inset_0_1px_0_rgba(0,0,0,0.03)] focus:outline-2 focus:outline-offset-0 focus:outline-teal disabled:opacity-60';

export function sizeClasses(className: string | undefined, defaultHeight = 'h-10'): string {
  const hasWidth = /(^|\s)(w|max-w|flex)-/.test(className ?? '');
  const hasHeight = /(^|\s)h-/.test(className ?? '');
  return cn(!hasWidth && 'w-full', !hasHeight && defaultHeight);
}

function borderFor(invalid: boolean) {
  return invalid ? 'border-brick focus:outline-brick' : 'border-graphite/25 hover:border-graphite/40';
}

export const Input = forwardRef<HTMLInputElement, InputHTMLAttributes<HTMLInputElement>>(function Input({ className, id, ...rest }, ref) {
  const field = useFieldControl();
  const invalid = !!field?.invalid || rest['aria-invalid'] === true;
  return (
    <input
      ref={ref}
      id={id ?? field?.id}
      aria-invalid={invalid || undefined}
      aria-describedby={field?.describedBy}
      className={cn(controlClass, sizeClasses(className), borderFor(invalid), className)}
      {...rest}
    />
  );
});

export const Textarea = forwardRef<HTMLTextAreaElement, TextareaHTMLAttributes<HTMLTextAreaElement>>(function Textarea(
  { className, id, rows = 3, ...rest },
  ref,
) {
  const field = useFieldControl();
  const invalid = !!field?.invalid;
  return (
    <textarea
      ref={ref}
      id={id ?? field?.id}
      rows={rows}
      aria-invalid={invalid || undefined}
      aria-describedby={field?.describedBy}
      className={cn(controlClass, sizeClasses(className, ''), 'py-2', borderFor(invalid), className)}
      {...rest}
    />
  );
});
