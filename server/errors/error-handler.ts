import type { ErrorRequestHandler } from 'express';
import { ZodError } from 'zod';
import type { InvalidReadingError } from '@shared/domain/reading-input';
import type { Logger } from 'pino';
import type { ApiErrorCode, BodyErrorCode } from '@shared/schemas/errors';
import type { Phrase } from '@shared/i18n/phrase';
import { phraseWords } from '@shared/i18n/phrase';
import { sourceLanguage } from '@shared/i18n/languages';
import { isCatalogueMessage, issuesInWords } from '@shared/i18n/validation';
import { languageOf, translatorFor } from '../i18n/translator';
import type { TFunction } from 'i18next';
import { AppError, refusal, type RefusalKey } from './app-error';

interface HttpishError {
  status?: number;
  statusCode?: number;
  type?: string;
  expose?: boolean;
  message?: string;
  code?: string;
}

// The body parser's refusals, by its error type: its own words never reach the client.
const bodyErrors: Record<string, RefusalKey> = {
  'entity.parse.failed': 'request.notJson',
  'entity.too.large': 'request.tooLarge',
  'encoding.unsupported': 'request.encodingUnsupported',
  'charset.unsupported': 'request.charsetUnsupported',
  'entity.verify.failed': 'request.notChecked',
  'request.aborted': 'request.cutOff',
  'request.size.invalid': 'request.wrongLength',
  'stream.encoding.set': 'request.unreadable',
  'stream.not.readable': 'request.unreadable',
  'parameters.too.many': 'request.tooManyParameters',
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

/**
 * The first issue of a refused body as a person reads it, in the language `t` writes. A schema's own message names
 * its field in words ("Say why the hold stays."), so it stands alone: a path such as "readings.0.entry" is not for a
 * person. zod's own words do not name one, so the path goes in front of them.
 */
function firstIssueWords(err: ZodError, t: TFunction): string {
  const issue = err.issues[0];
  if (!issue) return phraseWords(refusal('request.invalid'), t);
  const first = issuesInWords([issue], t)[0]!;
  if (isCatalogueMessage(issue.message)) return first.message;
  return phraseWords(
    refusal('request.invalidField', { field: first.path || 'request', problem: first.message }),
    t,
  );
}

/** One place that turns every error into `{ code, message, issues? }`; bad input is never a 500. */
export function errorHandler(logger: Logger): ErrorRequestHandler {
  return (err, req, res, _next) => {
    if (res.headersSent) return;
    // In the language of the screen that asked: the screens send theirs as Accept-Language (src/lib/api-client.ts).
    const words = (phrase: Phrase) => phraseWords(phrase, translatorFor(languageOf(req)));
    if (err instanceof AppError) {
      // A 5xx the app names (a store that does not answer) is still the operator's to see, with its cause.
      if (err.status >= 500) logger.error({ err, url: req.originalUrl }, err.message);
      if (typeof err.details?.retryAfterSeconds === 'number') {
        res.set('Retry-After', String(err.details.retryAfterSeconds));
      }
      res.status(err.status).json({ code: err.code, message: words(err.words), ...err.details });
      return;
    }
    if (err instanceof ZodError) {
      res.status(400).json({
        code: 'invalid_input' satisfies ApiErrorCode,
        message: firstIssueWords(err, translatorFor(languageOf(req))),
        // Every issue in English, for a developer.
        issues: issuesInWords(err.issues, translatorFor(sourceLanguage)),
      });
      return;
    }
    if (err && typeof err === 'object' && (err as Error).name === 'InvalidReadingError') {
      const e = err as InvalidReadingError;
      res.status(400).json({
        code: e.code,
        message: words(
          refusal('readings.invalid', { checkpoint: e.checkpointLabel, reason: { phrase: e.reason } }),
        ),
      });
      return;
    }
    if (databaseUnreachable(err)) {
      logger.error({ err, url: req.originalUrl }, 'database unreachable');
      res
        .status(503)
        .set('Retry-After', '5')
        .json({
          code: 'database_unavailable' satisfies ApiErrorCode,
          message: words(refusal('request.databaseUnavailable')),
        });
      return;
    }
    const e = err as HttpishError;
    const status = e.status ?? e.statusCode;
    if (status && status >= 400 && status < 500) {
      // The body parser's own words (and zlib's codes for a broken gzip body) never reach the client.
      const known = e.type ? bodyErrors[e.type] : undefined;
      if (known) {
        res
          .status(status)
          .json({ code: e.type!.replace(/\./g, '_') as BodyErrorCode, message: words(refusal(known)) });
        return;
      }
      res.status(status).json(
        e.expose && typeof e.code === 'string' && /^[a-z_]+$/.test(e.code) && e.message
          ? { code: e.code, message: e.message }
          : {
              code: 'request_refused' satisfies ApiErrorCode,
              message: words(refusal('request.refused')),
            },
      );
      return;
    }
    logger.error({ err, url: req.originalUrl }, 'unhandled error');
    res.status(500).json({
      code: 'internal' satisfies ApiErrorCode,
      message: words(refusal('request.internal')),
    });
  };
}
