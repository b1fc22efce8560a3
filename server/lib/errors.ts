/** Typed errors thrown by services; the one error handler maps them to `{ error: { code, message, details? } }`. */
export interface ErrorDetail {
  path: string;
  message: string;
}

export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details?: ErrorDetail[],
  ) {
    super(message);
    this.name = new.target.name;
  }
}

export class BadRequestError extends AppError {
  constructor(message: string, code = 'bad_request', details?: ErrorDetail[]) {
    super(400, code, message, details);
  }
}

export class UnauthorizedError extends AppError {
  constructor(message = 'sign in first', code = 'unauthenticated') {
    super(401, code, message);
  }
}

export class ForbiddenError extends AppError {
  constructor(message = 'your role does not allow this', code = 'forbidden') {
    super(403, code, message);
  }
}

/** Also used for another company's ids: they must look exactly like ids that do not exist. */
export class NotFoundError extends AppError {
  constructor(what = 'record') {
    super(404, 'not_found', `${what} not found`);
  }
}

export class ConflictError extends AppError {
  constructor(message: string, code = 'conflict', details?: ErrorDetail[]) {
    super(409, code, message, details);
  }
}

export class ValidationError extends AppError {
  constructor(details: ErrorDetail[], message?: string) {
    super(422, 'validation_failed', message ?? details.map((d) => (d.path ? `${d.path}: ${d.message}` : d.message)).join('; '), details);
  }
}

/** A 422 for one field, for rules a schema cannot express (e.g. "that customer is not yours"). */
export function fieldError(path: string, message: string): ValidationError {
  return new ValidationError([{ path, message }]);
}
