import type { HTMLAttributes, TdHTMLAttributes, ThHTMLAttributes } from 'react';
import { cn } from '../../lib/cn';

/** A ruled table on a card that scrolls sideways on a narrow screen instead of squashing. */
export function Table({ className, children, ...rest }: HTMLAttributes<HTMLTableElement>) {
  return (
    // `relative` keeps absolutely placed children (screen-reader-only headers) inside the scroll
    // box; without it they widen the page on a phone. The box takes focus so a keyboard can scroll it.
    <div
      className="relative overflow-x-auto rounded-lg border border-paper-line bg-white/80 shadow-sm focus-visible:outline-2 focus-visible:outline-teal"
      role="region"
      aria-label={rest['aria-label'] ?? 'Table'}
      tabIndex={0}
    >
      <table className={cn('w-full border-collapse text-sm', className)} {...rest}>
        {children}
      </table>
    </div>
  );
}

export function THead(props: HTMLAttributes<HTMLTableSectionElement>) {
  return <thead className="bg-paper-dark/70 text-left text-xs uppercase tracking-wide text-graphite-light" {...props} />;
}

export function TBody(props: HTMLAttributes<HTMLTableSectionElement>) {
  return <tbody className="divide-y divide-paper-line" {...props} />;
}

export function Tr({ className, ...rest }: HTMLAttributes<HTMLTableRowElement>) {
  return <tr className={cn('align-middle', className)} {...rest} />;
}

export function Th({ className, ...rest }: ThHTMLAttributes<HTMLTableCellElement>) {
  return <th scope="col" className={cn('whitespace-nowrap px-3 py-2 font-semibold', className)} {...rest} />;
}

export function Td({ className, ...rest }: TdHTMLAttributes<HTMLTableCellElement>) {
  return <td className={cn('px-3 py-2.5', className)} {...rest} />;
}
