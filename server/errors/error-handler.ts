import type { ErrorRequestHandler } from 'express';
import { ZodError } from 'zod';
import type { Logger } from 'pino';
import type { ApiErrorCode, BodyErrorCode } from '@shared/schemas/errors';
import { AppError } from './app-error';

interface HttpishError {
  status?: number;
  statusCode?: number;
  type?: string;
  expose?: boolean;
  message?: string;
  code?: string;
}

const bodyErrors: Record<string, string> = {
  'entity.parse.failed': 'The request body is not valid JSON.',
  'entity.too.large': 'The request body is too large.',
  'encoding.unsupported': 'The request body encoding is not supported.',
  'charset.unsupported': 'The request body charset is not supported.',
  'entity.verify.failed': 'The request body could not be checked.',
  'request.aborted': 'The request body was cut off before its end.',
  'request.size.invalid': 'The request body is not as long as it says.',
  'stream.encoding.set': 'The request body could not be read.',
  'stream.not.readable': 'The request body could not be read.',
  'parameters.too.many': 'The request has too many parameters.',
};

/** One place that turns every error into `{ code, message, issues? }`; bad input is never a 500. */
export function errorHandler(logger: Logger): ErrorRequestHandler {
  return (err, req, res, _next) => {
    if (res.headersSent) return;
    if (err instanceof AppError) {
      // A 5xx the app names (a store that does not answer) is still the operator's to see, with its cause.
      if (err.status >= 500) logger.error({ err, url: req.originalUrl }, err.message);
      if (typeof err.details?.retryAfterSeconds === 'number') {
        res.set('Retry-After', String(err.details.retryAfterSeconds));
      }
      res.status(err.status).json({ code: err.code, message: err.message, ...err.details });
      return;
    }
    if (err instanceof ZodError) {
      const issues = err.issues.map((i) => ({ path: i.path.join('.'), message: i.message }));
      const first = issues[0];
      res.status(400).json({
        code: 'invalid_input' satisfies ApiErrorCode,
        message: first ? `${first.path || 'request'}: ${first.message}` : 'The request is not valid.',
        issues,
      });
      return;
    }
    if (err && typeof err === 'object' && (err as Error).name === 'InvalidReadingError') {
      const e = err as Error & { code?: string };
      res.status(400).json({ code: e.code ?? 'invalid_reading', message: e.message });
      return;
    }
    const e = err as HttpishError;
    const status = e.status ?? e.statusCode;
    if (status && status >= 400 && status < 500) {
      // The body parser's own words (and zlib's codes for a broken gzip body) never reach the client.
      const known = e.type ? bodyErrors[e.type] : undefined;
      if (known) {
        res.status(status).json({ code: e.type!.replace(/\./g, '_') as BodyErrorCode, message: known });
        return;
      }
      res.status(status).json(
        e.expose && typeof e.code === 'string' && /^[a-z_]+$/.test(e.code) && e.message
          ? { code: e.code, message: e.message }
          : {
              code: 'request_refused' satisfies ApiErrorCode,
              message: 'The request could not be read. Send it again; if it keeps failing, reload the page.',
            },
      );
      return;
    }
    logger.error({ err, url: req.originalUrl }, 'unhandled error');
    res.status(500).json({
      code: 'internal' satisfies ApiErrorCode,
      message: 'Something went wrong on the server. Nothing was saved.',
    });
  };
}
