import type { ReactNode } from 'react';
import { isApiError } from '../../lib/api-client';
import { asSentence } from '../../lib/form-errors';
import { Button } from './button';

/** Shown where a list has nothing in it: what is missing and, often, the action that fills it. */
export function EmptyState({ title, children, action }: { title: string; children?: ReactNode; action?: ReactNode }) {
  return (
    <div className="rounded-lg border border-dashed border-graphite/25 bg-white/50 px-6 py-10 text-center">
      <p className="font-semibold text-graphite">{title}</p>
      {children && <div className="mx-auto mt-1 max-w-md text-sm text-graphite-light">{children}</div>}
      {action && <div className="mt-4 flex justify-center">{action}</div>}
    </div>
  );
}

/** Shown where loading failed, with the server's message and a retry. */
export function ErrorState({ error, onRetry, title = 'This could not be loaded' }: { error: unknown; onRetry?: () => void; title?: string }) {
  const message = isApiError(error) || error instanceof Error ? asSentence(error.message) : 'Unknown error.';
  return (
    <div role="alert" className="rounded-lg border border-brick/40 bg-brick-light/25 px-5 py-4">
      <p className="font-semibold text-brick-dark">{title}</p>
      <p className="mt-1 text-sm text-graphite">{message}</p>
      {onRetry && (
        <Button variant="secondary" size="sm" className="mt-3" onClick={onRetry}>
          Try again
        </Button>
      )}
    </div>
  );
}

/** A message strip at the top of a form or page. */
export function Alert({ tone = 'error', children }: { tone?: 'error' | 'success' | 'info' | 'caution'; children: ReactNode }) {
  const tones = {
    error: 'border-brick/40 bg-brick-light/25 text-brick-dark',
    success: 'border-teal/40 bg-teal-light/30 text-teal-dark',
    info: 'border-sky-dark/30 bg-sky-light/60 text-graphite',
    caution: 'border-straw-dark/40 bg-straw-light/40 text-graphite',
  } as const;
  return (
    <div role={tone === 'error' ? 'alert' : 'status'} className={`rounded-md border px-3 py-2 text-sm ${tones[tone]}`}>
      {children}
    </div>
  );
}
