import type { ReactNode } from 'react';

/** A fold of the job sheet: a large heading that opens and closes with one tap. */
export function SheetSection({
  title,
  children,
  defaultOpen = false,
  testId,
}: {
  title: ReactNode;
  children: ReactNode;
  defaultOpen?: boolean;
  testId?: string;
}) {
  return (
    <details
      open={defaultOpen}
      className="mb-3 rounded-lg border-2 border-graphite/25 bg-white/90 shadow-sm [&[open]>summary>span.chev]:rotate-90"
      data-testid={testId}
    >
      <summary className="flex min-h-12 cursor-pointer list-none items-center gap-2 px-3 py-2 text-xl font-bold">
        <span aria-hidden className="chev inline-block transition-transform">
          ▸
        </span>
        {title}
      </summary>
      <div className="border-t-2 border-graphite/10 px-3 py-3">{children}</div>
    </details>
  );
}
