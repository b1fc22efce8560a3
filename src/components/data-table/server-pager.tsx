import { Button } from '../ui';

/** The server's pages as loaded so far: `onLoadMore` asks for the page after the last one. */
export type ServerPages = {
  /** Rows loaded so far and how many the server holds for this search (unknown until it says). */
  loaded: number;
  total?: number;
  hasMore: boolean;
  loading: boolean;
  failed: boolean;
  onLoadMore: () => void;
  /** What a row is, plural ("jobs"): the button and the count say it. */
  noun: string;
};

/** Under a server-paged table: how many rows of how many are shown and the button for the next page. */
export function ServerPager({ label, pages }: { label: string; pages: ServerPages }) {
  if (!pages.hasMore && !pages.failed) return null;
  return (
    <nav aria-label={`${label} pages`} className="mt-4 flex flex-col items-center gap-2">
      <div className="flex flex-wrap items-center justify-center gap-3">
        <span className="text-sm text-graphite-light" aria-live="polite">
          Showing {pages.loaded}
          {pages.total !== undefined ? ` of ${pages.total}` : ''} {pages.noun}
        </span>
        <Button variant="secondary" onClick={pages.onLoadMore} busy={pages.loading}>
          {pages.loading ? 'Loading…' : `Load more ${pages.noun}`}
        </Button>
      </div>
      {pages.failed && (
        <p role="alert" className="text-center text-sm text-brick-dark">
          The next {pages.noun} could not be loaded; try again.
        </p>
      )}
    </nav>
  );
}
