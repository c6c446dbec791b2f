import type { ErrorRequestHandler } from 'express';
import { ZodError } from 'zod';
import type { Logger } from 'pino';
import { AppError } from './app-error';

interface HttpishError {
  status?: number;
  statusCode?: number;
  type?: string;
  expose?: boolean;
  message?: string;
  code?: string;
}

/** One place that turns every error into `{ code, message, issues? }`; bad input is never a 500. */
export function errorHandler(logger: Logger): ErrorRequestHandler {
  return (err, req, res, _next) => {
    if (res.headersSent) return;
    if (err instanceof AppError) {
      res.status(err.status).json({ code: err.code, message: err.message, ...err.details });
      return;
    }
    if (err instanceof ZodError) {
      const issues = err.issues.map((i) => ({ path: i.path.join('.'), message: i.message }));
      const first = issues[0];
      res.status(400).json({
        code: 'invalid_input',
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
      const messages: Record<string, string> = {
        'entity.parse.failed': 'The request body is not valid JSON.',
        'entity.too.large': 'The request body is too large.',
        'encoding.unsupported': 'The request body encoding is not supported.',
        'charset.unsupported': 'The request body charset is not supported.',
      };
      res.status(status).json({
        code: e.type?.replace(/\./g, '_') ?? e.code ?? 'bad_request',
        message:
          (e.type && messages[e.type]) ?? (e.expose && e.message ? e.message : 'The request was refused.'),
      });
      return;
    }
    logger.error({ err, url: req.originalUrl }, 'unhandled error');
    res
      .status(500)
      .json({ code: 'internal', message: 'Something went wrong on the server. Nothing was saved.' });
  };
}
