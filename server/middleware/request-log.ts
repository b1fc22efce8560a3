import { randomUUID } from 'node:crypto';
import type { NextFunction, Request, Response } from 'express';
import { redactUrl } from '../lib/log-redact';
import type { Logger } from '../lib/logger';

declare module 'node:http' {
  interface IncomingMessage {
    /** The request id: the proxy's X-Request-Id when sane, else a new UUID (see requestLog). */
    id: string;
    /** A logger whose lines carry this request's id, method and path. */
    log: Logger;
  }
}

const REQUEST_ID = /^[\w.-]{1,100}$/;

/**
 * One log line per request when its answer is sent or the client goes away: id (the proxy's
 * X-Request-Id when it sends a sane one, else a new UUID, echoed back), method, path with private
 * tokens redacted, status, time, and who asked (user and organisation ids; nothing else about them).
 * The fields (`req`, `res`, `responseTime`, `userId`, `organisationId`, "request completed" /
 * "request errored") are pino-http's; written by hand because pino-http makes two child loggers per
 * request, and serialises the request for them, whether anything logs through them or not. Here
 * `req.log` is made only when a handler logs.
 */
export function requestLog(logger: Logger) {
  return (req: Request, res: Response, next: NextFunction) => {
    const given = req.headers['x-request-id'];
    const id = typeof given === 'string' && REQUEST_ID.test(given) ? given : randomUUID();
    res.setHeader('X-Request-Id', id);
    req.id = id;
    const started = Date.now();
    // The path as it arrived: routers mounted further in rewrite req.url.
    const url = req.originalUrl;
    const fields = () => ({ id, method: req.method, url: redactUrl(url) });
    let child: Logger | undefined;
    Object.defineProperty(req, 'log', {
      configurable: true,
      get: () => (child ??= logger.child({ req: fields() })),
    });
    const done = (err?: Error) => {
      res.removeListener('close', done);
      res.removeListener('finish', done);
      res.removeListener('error', done);
      const user = req.user;
      const line = {
        req: fields(),
        ...(user ? { userId: user.id, organisationId: user.organisationId } : {}),
        res: { statusCode: res.statusCode },
        responseTime: Date.now() - started,
      };
      if (err || res.statusCode >= 500) logger.error({ ...line, err: err ?? new Error(`failed with status code ${res.statusCode}`) }, 'request errored');
      else logger.info(line, 'request completed');
    };
    res.on('close', done);
    res.on('finish', done);
    res.on('error', done);
    next();
  };
}
