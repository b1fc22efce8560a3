import type { ReactNode } from 'react';
import { useDocumentTitle } from './use-document-title';

/** The title of a page, an optional line beneath it and the page's main actions. */
export function PageHeader({
  title,
  subtitle,
  actions,
  eyebrow,
  documentTitle,
}: {
  title: ReactNode;
  subtitle?: ReactNode;
  actions?: ReactNode;
  eyebrow?: ReactNode;
  /** The tab title; defaults to `title` when that is plain text. */
  documentTitle?: string;
}) {
  useDocumentTitle(documentTitle ?? (typeof title === 'string' ? title : undefined));
  return (
    <header className="mb-5 flex flex-col gap-3 sm:flex-row sm:items-end sm:justify-between">
      <div className="min-w-0">
        {eyebrow && <div className="mb-1 font-mono text-xs uppercase tracking-wider text-timber">{eyebrow}</div>}
        <h1 className="text-2xl font-semibold tracking-tight text-graphite">{title}</h1>
        {subtitle && <p className="mt-1 text-sm text-graphite-light">{subtitle}</p>}
      </div>
      {actions && <div className="flex flex-wrap gap-2">{actions}</div>}
    </header>
  );
}
