// The one error type the server throws on purpose: it carries an HTTP status and, for validation, the fields at fault.
import type { ZodError } from 'zod'

export type FieldError = { field: string; message: string }

export class AppError extends Error {
  constructor(
    public status: number,
    public code: string,
    message: string,
    public fields?: FieldError[],
    public details?: unknown,
  ) {
    super(message)
  }

  static badRequest(message: string, fields?: FieldError[]) {
    return new AppError(400, 'bad_request', message, fields)
  }
  static unauthorized(message = 'Sign in to continue.') {
    return new AppError(401, 'unauthorized', message)
  }
  static forbidden(message = 'Your role in this operation does not allow that.') {
    return new AppError(403, 'forbidden', message)
  }
  static notFound(what = 'Record') {
    return new AppError(404, 'not_found', `${what} not found.`)
  }
  static conflict(message: string, details?: unknown) {
    return new AppError(409, 'conflict', message, undefined, details)
  }
}

export function fieldErrorsFromZod(err: ZodError): FieldError[] {
  return err.issues.map((i) => ({ field: i.path.length ? i.path.join('.') : '(body)', message: i.message }))
}

export function validationError(err: ZodError, where = 'request'): AppError {
  const fields = fieldErrorsFromZod(err)
  return new AppError(400, 'validation_failed', `The ${where} has ${fields.length} invalid field${fields.length === 1 ? '' : 's'}: ${fields.map((f) => f.field).join(', ')}.`, fields)
}
