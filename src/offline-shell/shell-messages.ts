/** What the page and the service worker say to each other, and which API reads are kept offline. */
export type ShellMessage = { type: 'keep'; urls: string[] } | { type: 'SKIP_WAITING' };

/** The cache of API reads kept for offline use (the shell itself is the build's precache). */
export const OFFLINE_DATA_CACHE = 'quiltline-data-v1';

// Who is signed in, the installer's list, job sheets, photo thumbnails.
const API_KEEP = [/^\/api\/auth\/me$/, /^\/api\/my-jobs$/, /^\/api\/jobs\/[0-9a-f-]{36}(\/job-sheet)?$/, /^\/api\/photos\/[0-9a-f-]{36}\/thumb$/];

export function isKeptApi(pathname: string): boolean {
  return API_KEEP.some((re) => re.test(pathname));
}
