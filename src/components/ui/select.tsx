import { forwardRef, type SelectHTMLAttributes } from 'react';
import { cn } from '../../lib/cn';
import { controlClass, sizeClasses } from './input';
import { useFieldControl } from './field';

export const Select = forwardRef<HTMLSelectElement, SelectHTMLAttributes<HTMLSelectElement>>(function Select({ className, id, children, ...rest }, ref) {
  const field = useFieldControl();
  const invalid = !!field?.invalid;
  return (
    <select
      ref={ref}
      id={id ?? field?.id}
      aria-invalid={invalid || undefined}
      aria-describedby={field?.describedBy}
      className={cn(
        controlClass,
        sizeClasses(className),
        'appearance-none bg-[length:12px] bg-[right_0.75rem_center] bg-no-repeat pr-9',
        "bg-[url(\"data:image/svg+xml,%3Csvg xmlns='http://www.w3.org/2000/svg' viewBox='0 0 12 8'%3E%3Cpath d='M1 1l5 5 5-5' fill='none' stroke='%2333363b' stroke-width='1.6'/%3E%3C/svg%3E\")]",
        invalid ? 'border-brick' : 'border-graphite/25 hover:border-graphite/40',
        className,
      )}
      {...rest}
    >
      {children}
    </select>
  );
});
