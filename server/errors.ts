import type { ErrorRequestHandler } from 'express';
import { ZodError, type z } from 'zod';
import type { Logger } from 'pino';

/** The one error type services throw; the error middleware maps it to HTTP. */
export class AppError extends Error {
  constructor(
    public readonly code: string,
    message: string,
    public readonly status: number,
    public readonly extra: Record<string, unknown> = {},
  ) {
    super(message);
    this.name = 'AppError';
  }
}

export const notFound = (what = 'That record') => new AppError('not_found', `${what} was not found.`, 404);
export const forbidden = (message: string) => new AppError('forbidden', message, 403);
export const unauthorized = () => new AppError('unauthorized', 'Please sign in first.', 401);
export const conflict = (message: string, extra: Record<string, unknown> = {}) =>
  new AppError('conflict', message, 409, extra);

/** Turns zod issues into one sentence plus a message per field. */
export function fromZod(err: ZodError): AppError {
  const fields: Record<string, string> = {};
  for (const issue of err.issues) {
    const key = issue.path.length ? issue.path.join('.') : '_';
    if (!(key in fields)) fields[key] = keeperMessage(issue);
  }
  const first = err.issues[0];
  const message = first ? keeperMessage(first) : 'Some of the details are not valid.';
  return new AppError('invalid', message, 400, { fields });
}

function keeperMessage(issue: z.core.$ZodIssue): string {
  const field = issue.path.length ? String(issue.path[issue.path.length - 1]) : '';
  switch (issue.code) {
    case 'unrecognized_keys':
      return `These details are not expected here: ${issue.keys.join(', ')}.`;
    case 'invalid_type':
      // zod's own text for a missing field is "Invalid input: expected …"; say what is missing instead.
      if (issue.message.startsWith('Invalid input')) {
        return field ? `${humanise(field)} is missing or not the right kind of value.` : 'The request body is missing or not valid.';
      }
      return issue.message;
    default:
      if (issue.message.startsWith('Invalid') || issue.message.startsWith('Too ')) {
        return field ? `${humanise(field)}: ${issue.message.toLowerCase()}.` : issue.message;
      }
      return issue.message;
  }
}

const humanise = (field: string) =>
  field
    .replace(/([a-z])([A-Z])/g, '$1 $2')
    .replace(/[-_]/g, ' ')
    .replace(/^./, (c) => c.toUpperCase());

interface HttpishError {
  status?: number;
  statusCode?: number;
  type?: string;
  expose?: boolean;
}

/** Maps every thrown thing to `{ error: { code, message } }`; unknown errors are logged and answer 500 without detail. */
export function errorMiddleware(logger: Logger): ErrorRequestHandler {
  return (err, _req, res, _next) => {
    let appErr: AppError;
    if (err instanceof AppError) appErr = err;
    else if (err instanceof ZodError) appErr = fromZod(err);
    else if ((err as HttpishError)?.type === 'entity.parse.failed')
      appErr = new AppError('invalid_json', 'The request body is not valid JSON.', 400);
    else if ((err as HttpishError)?.type === 'entity.too.large')
      appErr = new AppError('too_large', 'The request is too large.', 413);
    else if ((err as HttpishError)?.type === 'charset.unsupported' || (err as HttpishError)?.type === 'encoding.unsupported')
      appErr = new AppError('unsupported', 'The request encoding is not supported.', 415);
    else if (typeof (err as HttpishError)?.status === 'number' && (err as HttpishError).status! >= 400 && (err as HttpishError).status! < 500)
      appErr = new AppError('bad_request', (err as Error).message || 'The request could not be read.', (err as HttpishError).status!);
    else {
      logger.error({ err }, 'unhandled error');
      appErr = new AppError('internal', 'Something went wrong on our side. Your last change may not have been saved; please try again.', 500);
    }
    if (res.headersSent) return;
    res.status(appErr.status).json({ error: { code: appErr.code, message: appErr.message, ...pickFields(appErr) }, ...omitFields(appErr.extra) });
  };
}

const pickFields = (e: AppError) => (e.extra.fields ? { fields: e.extra.fields } : {});
const omitFields = (extra: Record<string, unknown>) => {
  const { fields: _f, ...rest } = extra;
  return rest;
};
