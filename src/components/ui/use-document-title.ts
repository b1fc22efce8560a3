import { useEffect } from 'react';

/** Sets the browser tab's title to "<title> · Quiltline" while the page is shown. */
export function useDocumentTitle(title: string | undefined) {
  useEffect(() => {
    if (!title) return;
    const before = document.title;
    document.title = `${title} · Quiltline`;
    return () => {
      document.title = before;
    };
  }, [title]);
}
