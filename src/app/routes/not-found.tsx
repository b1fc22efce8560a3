import { ButtonLink } from '../../components/ui';

/** Any path the app does not know. */
export default function NotFoundPage() {
  return (
    <div className="flex min-h-[60dvh] flex-col items-center justify-center px-4 text-center">
      <p className="font-mono text-sm text-timber">404</p>
      <h1 className="mt-2 text-2xl font-semibold">Nothing on this page of the notebook</h1>
      <p className="mt-2 max-w-md text-sm text-graphite-light">The address may be mistyped, or the record was removed or belongs to another company.</p>
      <ButtonLink to="/" variant="primary" className="mt-6">
        Back to the start
      </ButtonLink>
    </div>
  );
}
