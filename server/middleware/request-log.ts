import { randomUUID } from 'node:crypto';
import type { IncomingMessage, ServerResponse } from 'node:http';
import type { Request } from 'express';
import { stdSerializers } from 'pino';
import { pinoHttp } from 'pino-http';
import { redactUrl } from '../lib/log-redact';
import type { Logger } from '../lib/logger';

const REQUEST_ID = /^[\w.-]{1,100}$/;

/**
 * One log line per request: id (the proxy's X-Request-Id when it sends a sane one, else a new
 * UUID, echoed back), method, path with private tokens redacted, status, time, and who asked
 * (user and organisation ids; nothing else about them). Through pino-http, its usual fields.
 */
export function requestLog(logger: Logger) {
  return pinoHttp({
    logger,
    genReqId(req: IncomingMessage, res: ServerResponse) {
      const given = req.headers['x-request-id'];
      const id = typeof given === 'string' && REQUEST_ID.test(given) ? given : randomUUID();
      res.setHeader('X-Request-Id', id);
      return id;
    },
    // Who asked goes into the line itself. customProps would do it through a child logger made as the
    // request ends (its bindings stringified first), on every request: about as much time again as the
    // rest of the line costs.
    customSuccessObject: (req: IncomingMessage, _res: ServerResponse, line: object) => withUser(req, line),
    customErrorObject: (req: IncomingMessage, _res: ServerResponse, _err: Error, line: object) => withUser(req, line),
    // Ours pick three fields from the request and one from the response: given the raw objects,
    // not pino's full copies of them first (every header, on every request).
    wrapSerializers: false,
    serializers: {
      // The path as it arrived (originalUrl): routers mounted further in rewrite req.url.
      req: (req: { id: string; method: string; url: string; originalUrl?: string }) => ({
        id: req.id,
        method: req.method,
        url: redactUrl(req.originalUrl ?? req.url),
      }),
      res: (res: { statusCode: number }) => ({ statusCode: res.statusCode }),
      err: stdSerializers.err,
    },
  });
}

/** The line with the signed-in user's and company's ids (nothing else about them), when someone is signed in. */
function withUser(req: IncomingMessage, line: object): object {
  const user = (req as Request).user;
  return user ? { ...line, userId: user.id, organisationId: user.organisationId } : line;
}
