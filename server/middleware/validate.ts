import type { NextFunction, Request, Response } from 'express';
import type { z } from 'zod';
import { ValidationError, type ErrorDetail } from '../lib/errors';

type Schemas = { body?: z.ZodType; params?: z.ZodType; query?: z.ZodType };

/** zod issues as `{ path, message }`, path like `propertyAddress.postcode`. */
export function zodDetails(error: z.ZodError, prefix?: string): ErrorDetail[] {
  return error.issues.map((i) => {
    const p = i.path.map(String).join('.');
    return { path: prefix && p ? p : p || (prefix ?? ''), message: i.message };
  });
}

/**
 * Parses body, params and query with the shared schemas and REPLACES them with the parsed values
 * (defaults filled, strings trimmed), so controllers never parse again. Failure → 422 naming the field.
 */
export function validate(schemas: Schemas) {
  return (req: Request, _res: Response, next: NextFunction) => {
    const details: ErrorDetail[] = [];
    const parsed: Partial<Record<keyof Schemas, unknown>> = {};
    for (const part of ['params', 'query', 'body'] as const) {
      const schema = schemas[part];
      if (!schema) continue;
      const input = part === 'body' ? (req.body ?? {}) : req[part];
      const r = schema.safeParse(input);
      if (r.success) parsed[part] = r.data;
      else details.push(...zodDetails(r.error, part));
    }
    if (details.length) return next(new ValidationError(details));
    if ('body' in parsed) req.body = parsed.body;
    if ('params' in parsed) req.params = parsed.params as Request['params'];
    // Express 5 defines req.query as a getter; shadow it on this request.
    if ('query' in parsed) Object.defineProperty(req, 'query', { value: parsed.query, writable: true, configurable: true, enumerable: true });
    next();
  };
}
