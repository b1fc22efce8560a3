import { cn } from '../../lib/cn';

/** A small spinning ring; `label` is read by screen readers ("" to stay silent inside a busy button). */
export function Spinner({ size = 'md', label = 'Loading', className }: { size?: 'sm' | 'md' | 'lg'; label?: string; className?: string }) {
  const dim = size === 'sm' ? 'h-4 w-4 border-2' : size === 'lg' ? 'h-8 w-8 border-[3px]' : 'h-5 w-5 border-2';
  return (
    <span role={label ? 'status' : undefined} className={cn('inline-flex items-center', className)}>
      <span aria-hidden className={cn('animate-spin rounded-full border-current border-r-transparent', dim)} />
      {label && <span className="sr-only">{label}</span>}
    </span>
  );
}

/** A centred spinner with a line of text, for a page or panel that is loading. */
export function LoadingState({ label = 'Loading…' }: { label?: string }) {
  return (
    <div className="flex items-center justify-center gap-3 py-12 text-graphite-light" role="status" aria-live="polite">
      <Spinner label="" />
      <span className="text-sm">{label}</span>
    </div>
  );
}
