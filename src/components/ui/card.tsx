import type { HTMLAttributes, ReactNode } from 'react';
import { cn } from '../../lib/cn';

/** A sheet of the notebook: white-ish panel with a soft edge. */
export function Card({ className, ...rest }: HTMLAttributes<HTMLDivElement>) {
  return <div className={cn('rounded-lg border border-paper-line bg-white/85 p-4 shadow-sm sm:p-5', className)} {...rest} />;
}

export function CardTitle({ children, action }: { children: ReactNode; action?: ReactNode }) {
  return (
    <div className="mb-3 flex items-center justify-between gap-3">
      <h2 className="text-base font-semibold text-graphite">{children}</h2>
      {action}
    </div>
  );
}
