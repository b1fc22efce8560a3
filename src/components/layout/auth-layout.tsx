import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { useDocumentTitle } from '../ui/use-document-title';
import { Logo } from './logo';

/** A single card on the notebook paper, for signing in and setting a password. */
export function AuthLayout({ title, subtitle, children, footer }: { title: string; subtitle?: ReactNode; children: ReactNode; footer?: ReactNode }) {
  useDocumentTitle(title);
  return (
    <div className="notebook-paper flex min-h-dvh flex-col items-center px-4 py-10 sm:justify-center">
      <Link to="/" className="mb-6" aria-label="Quiltline home">
        <Logo />
      </Link>
      <main className="w-full max-w-sm rounded-xl border border-paper-line bg-white/90 p-6 shadow-[0_1px_0_#e7e0cf,0_8px_24px_-12px_rgba(51,54,59,0.25)]">
        <h1 className="text-xl font-semibold tracking-tight">{title}</h1>
        {subtitle && <p className="mt-1 text-sm text-graphite-light">{subtitle}</p>}
        <div className="mt-5">{children}</div>
      </main>
      {footer && <div className="mt-4 text-sm text-graphite-light">{footer}</div>}
    </div>
  );
}
