import type { ErrorRequestHandler, RequestHandler } from 'express';
import { NotFoundError, OptimisticLockError, UniqueConstraintViolationException, ForeignKeyConstraintViolationException } from '@mikro-orm/core';
import { ZodError } from 'zod';
import type { Problem } from '@shared/api';
import { isGeometryError } from '@shared/geometry/errors';
import type { Logger } from 'pino';

/** The one error type of the server: a status, a stable code and a message safe to show. */
export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly extra: Partial<Problem> = {},
  ) {
    super(message);
  }
}

export const badRequest = (message: string, errors?: Problem['errors']) =>
  new AppError(400, 'bad_request', message, errors ? { errors } : {});
export const unauthorized = (message = 'Sign in to continue.') => new AppError(401, 'unauthorized', message);
export const forbidden = (message = 'Your role does not allow this.') => new AppError(403, 'forbidden', message);
export const notFound = (what = 'Record') => new AppError(404, 'not_found', `${what} not found.`);
/** 409 for a stale version: carries the record as it stands now so the screen can show both. */
export const staleVersion = (current: unknown) =>
  new AppError(409, 'stale_version', 'Someone else changed this record since you opened it. Review their values and try again.', { current });
export const conflict = (message: string) => new AppError(409, 'conflict', message);

const TITLES: Record<number, string> = {
  400: 'Bad request',
  401: 'Unauthorized',
  403: 'Forbidden',
  404: 'Not found',
  409: 'Conflict',
  413: 'Payload too large',
  415: 'Unsupported media type',
  429: 'Too many requests',
  500: 'Internal server error',
};

function problem(status: number, code: string, detail: string, extra: Partial<Problem> = {}): Problem {
  return { type: `about:blank#${code}`, title: TITLES[status] ?? 'Error', status, detail, code, ...extra };
}

/** Turn zod issues into field paths like `alignment.1.0` or `station`. */
export function zodProblemErrors(error: ZodError): NonNullable<Problem['errors']> {
  return error.issues.map((issue) => ({
    path: issue.path.map(String).join('.') || '(body)',
    message: issue.message,
  }));
}

export const notFoundApi: RequestHandler = (req, _res, next) => {
  next(new AppError(404, 'not_found', `No API route ${req.method} ${req.path}.`));
};

/**
 * The single error middleware, registered last. Known errors keep their status; anything else
 * is logged and answered with a plain 500 (no stack or internals ever reach a client).
 */
export function errorHandler(logger: Logger): ErrorRequestHandler {
  return (err, req, res, _next) => {
    let body: Problem;
    if (err instanceof AppError) {
      body = problem(err.status, err.code, err.message, err.extra);
    } else if (isGeometryError(err)) {
      body = problem(400, `geometry_${err.code.toLowerCase()}`, err.message);
    } else if (err instanceof ZodError) {
      body = problem(400, 'validation', 'Some fields are not valid.', { errors: zodProblemErrors(err) });
    } else if (err instanceof NotFoundError) {
      body = problem(404, 'not_found', 'Record not found.');
    } else if (err instanceof OptimisticLockError) {
      body = problem(409, 'stale_version', 'Someone else changed this record since you opened it.');
    } else if (err instanceof UniqueConstraintViolationException) {
      body = problem(409, 'duplicate', 'A record with the same identifying values already exists.');
    } else if (err instanceof ForeignKeyConstraintViolationException) {
      body = problem(409, 'in_use', 'The record is referred to by other records, or refers to one that does not exist.');
    } else if (isBodyParserError(err)) {
      const status = err.status ?? 400;
      body =
        status === 413
          ? problem(413, 'too_large', 'The request body is larger than allowed.')
          : problem(400, 'malformed_body', 'The request body is not valid JSON.');
    } else {
      (req.log ?? logger).error({ err }, 'unhandled error');
      body = problem(500, 'internal', 'Something went wrong on the server. The error has been logged.');
    }
    res.status(body.status).type('application/problem+json').json(body);
  };
}

function isBodyParserError(err: unknown): err is { status?: number; type: string } {
  return typeof err === 'object' && err !== null && 'type' in err && typeof (err as { type: unknown }).type === 'string' &&
    ['entity.parse.failed', 'entity.too.large', 'encoding.unsupported', 'charset.unsupported', 'request.aborted', 'entity.verify.failed', 'request.size.invalid'].includes((err as { type: string }).type);
}
