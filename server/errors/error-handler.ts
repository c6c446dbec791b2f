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

// A database that cannot be reached (a node down, a pool that found no connection in time, a Galera node not yet
// ready): the request did nothing the client must fix, so it is a 503 with Retry-After, which the kiosk's queue
// answers by sending the same check id again; a check sent twice is stored once.
const unreachableNames = new Set([
  'SequelizeConnectionError',
  'SequelizeConnectionRefusedError',
  'SequelizeConnectionTimedOutError',
  'SequelizeConnectionAcquireTimeoutError',
  'SequelizeHostNotFoundError',
  'SequelizeHostNotReachableError',
  'SequelizeAccessDeniedError',
]);
const unreachableCodes = new Set([
  'ECONNREFUSED',
  'ECONNRESET',
  'ETIMEDOUT',
  'EHOSTUNREACH',
  'ER_GET_CONNECTION_TIMEOUT',
  'ER_CONNECTION_TIMEOUT',
  'ER_SOCKET_UNEXPECTED_CLOSE',
]);

type DatabaseishError = {
  name?: string;
  code?: string;
  errno?: number;
  parent?: unknown;
  original?: unknown;
};

/** Only errors the database layer raised (Sequelize's, or the connector's SqlError) count: a refused S3 or SMTP
 * connection is not the records database. */
export function databaseUnreachable(err: unknown): boolean {
  const e = err as DatabaseishError | null;
  if (!e || typeof e !== 'object' || typeof e.name !== 'string') return false;
  if (!e.name.startsWith('Sequelize') && e.name !== 'SqlError') return false;
  if (unreachableNames.has(e.name)) return true;
  return [e, e.parent, e.original].some((x) => {
    const cause = x as DatabaseishError | null | undefined;
    return !!cause && (cause.errno === 1047 || (!!cause.code && unreachableCodes.has(cause.code)));
  });
}

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
    if (databaseUnreachable(err)) {
      logger.error({ err, url: req.originalUrl }, 'database unreachable');
      res
        .status(503)
        .set('Retry-After', '5')
        .json({
          code: 'database_unavailable' satisfies ApiErrorCode,
          message:
            'The records database is not answering just now. Send it again in a few seconds: a check sent twice is stored once.',
        });
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
