import type { NextFunction, Request, Response } from 'express';
import { ForbiddenError } from '../lib/errors';

const STATE_CHANGING = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

/**
 * Refuses state-changing API requests that a browser sent from another origin (cross-site request
 * forgery with the session cookie). The cookie's SameSite=Lax does not cover another port on the
 * same host — that is the same *site* — so a page there could post to us with the cookie attached.
 *
 * Browsers label every request: `Sec-Fetch-Site` (Fetch Metadata) when they send it, else `Origin`,
 * else `Referer`; a request carrying none of them comes from a non-browser client, which holds no
 * victim's cookie. `Origin: null` (sandboxed frames, some redirects) is refused. The allowed origin
 * is APP_URL's, or the origin of the host the request reached (a dev proxy keeps the browser's Host).
 * The payments webhook (server to server, signed) is exempt; the customer's /pay pages are outside
 * /api and carry their own key in the URL.
 */
export function sameOrigin(appUrl: string, exempt: string[] = []) {
  const appOrigin = new URL(appUrl).origin;
  return (req: Request, _res: Response, next: NextFunction) => {
    if (!STATE_CHANGING.has(req.method) || exempt.some((p) => req.originalUrl.startsWith(p))) return next();
    const site = req.get('sec-fetch-site');
    if (site) return site === 'same-origin' || site === 'none' ? next() : next(refuse());
    const hostOrigin = `${req.protocol}://${req.get('host')}`;
    const allowed = (origin: string) => origin === appOrigin || origin === hostOrigin;
    const origin = req.get('origin');
    if (origin !== undefined) return allowed(origin) ? next() : next(refuse());
    const referer = req.get('referer');
    if (referer !== undefined) {
      let refOrigin = '';
      try {
        refOrigin = new URL(referer).origin;
      } catch {
        // an unparsable Referer is treated as foreign
      }
      return allowed(refOrigin) ? next() : next(refuse());
    }
    next();
  };
}

function refuse() {
  return new ForbiddenError('this request came from another site and was refused; open Quiltline itself and try again', 'cross_origin');
}
