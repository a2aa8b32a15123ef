// The one error middleware: every failure leaves as { error: { status, code, message, fields?, requestId } }, never a stack.
import type { NextFunction, Request, Response } from 'express'
import { ZodError } from 'zod'
import { AppError, validationError } from '../errors'

export function notFoundApi(req: Request, _res: Response, next: NextFunction) {
  next(new AppError(404, 'not_found', `No API route ${req.method} ${req.originalUrl.split('?')[0]}.`))
}

type BodyParserError = Error & { type?: string; status?: number; expose?: boolean }

// Express recognises error middleware by its four parameters.
export function errorHandler(err: unknown, req: Request, res: Response, _next: NextFunction) {
  let e: AppError
  if (err instanceof AppError) e = err
  else if (err instanceof ZodError) e = validationError(err)
  else {
    const b = err as BodyParserError
    if (b?.type === 'entity.parse.failed') e = new AppError(400, 'malformed_json', 'The request body is not valid JSON.')
    else if (b?.type === 'entity.too.large') e = new AppError(413, 'body_too_large', 'The request body is too large.')
    else if (b?.type === 'charset.unsupported' || b?.type === 'encoding.unsupported') e = new AppError(415, 'unsupported_encoding', 'Unsupported body encoding.')
    else if (b?.name === 'MulterError') {
      const code = (err as { code?: string }).code
      e = code === 'LIMIT_FILE_SIZE' ? new AppError(413, 'file_too_large', 'The file is too large.') : new AppError(400, 'upload_failed', `Upload refused: ${b.message}.`, [{ field: (err as { field?: string }).field ?? 'file', message: b.message }])
    } else if (typeof b?.status === 'number' && b.status >= 400 && b.status < 500 && b.expose) e = new AppError(b.status, 'bad_request', b.message)
    else {
      req.log?.error({ err }, 'unhandled error')
      e = new AppError(500, 'internal', 'Something went wrong on our side. The error has been logged.')
    }
  }
  res.status(e.status).json({
    error: {
      status: e.status,
      code: e.code,
      message: e.message,
      ...(e.fields ? { fields: e.fields } : {}),
      ...(e.details !== undefined ? { details: e.details } : {}),
      requestId: String(req.id ?? ''),
    },
  })
}
