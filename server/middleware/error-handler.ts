import type { ErrorRequestHandler, RequestHandler } from 'express';
import { ZodError } from 'zod';
import { DB_RETRY_AFTER_SECONDS, isDatabaseUnavailable } from '../lib/db-unavailable';
import { AppError } from '../lib/errors';
import { describeError, redactText, redactUrl } from '../lib/log-redact';
import { zodDetails } from './validate';

/** Unknown /api paths: JSON 404 rather than the SPA page. */
export const apiNotFound: RequestHandler = (req, res) => {
  res.status(404).json({ error: { code: 'not_found', message: `no API route ${req.method} ${req.originalUrl.split('?')[0]}` } });
};

/** The one error handler: every error becomes `{ error: { code, message, details? } }`. */
export const errorHandler: ErrorRequestHandler = (err, req, res, next) => {
  if (res.headersSent) return next(err);
  if (err instanceof AppError) {
    res.status(err.status).json({ error: { code: err.code, message: err.message, ...(err.details ? { details: err.details } : {}) } });
    return;
  }
  if (err instanceof ZodError) {
    const details = zodDetails(err);
    res.status(422).json({ error: { code: 'validation_failed', message: details.map((d) => `${d.path}: ${d.message}`).join('; '), details } });
    return;
  }
  // body-parser and multer errors carry a status and a type/code
  const status = typeof err?.status === 'number' ? err.status : typeof err?.statusCode === 'number' ? err.statusCode : 500;
  if (err?.type === 'entity.parse.failed') {
    res.status(400).json({ error: { code: 'invalid_json', message: 'the request body is not valid JSON' } });
    return;
  }
  if (err?.type === 'entity.too.large') {
    res.status(413).json({ error: { code: 'too_large', message: 'the request body is too large' } });
    return;
  }
  if (status >= 400 && status < 500) {
    res.status(status).json({ error: { code: String(err.code ?? 'bad_request').toLowerCase(), message: String(err.message ?? 'bad request') } });
    return;
  }
  if (isDatabaseUnavailable(err)) {
    req.log.warn(`${req.method} ${redactUrl(req.originalUrl)}: database unavailable (${redactText(String(err?.message ?? err))})`);
    res.setHeader('Retry-After', String(DB_RETRY_AFTER_SECONDS));
    res.status(503).json({ error: { code: 'service_unavailable', message: 'the service is briefly unavailable; try again in a few seconds' } });
    return;
  }
  req.log.error(`${req.method} ${redactUrl(req.originalUrl)}: ${describeError(err)}`);
  res.status(500).json({ error: { code: 'internal', message: 'something went wrong on the server' } });
};
