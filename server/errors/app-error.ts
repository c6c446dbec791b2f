import type { ApiErrorCode } from '@shared/schemas/errors';

export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: ApiErrorCode,
    message: string,
    readonly details?: Record<string, unknown>,
    cause?: unknown,
  ) {
    super(message, cause === undefined ? undefined : { cause });
    this.name = 'AppError';
  }
}

export const badRequest = (code: ApiErrorCode, message: string, details?: Record<string, unknown>) =>
  new AppError(400, code, message, details);
export const unauthorized = (message = 'Sign in first.', code: ApiErrorCode = 'not_signed_in') =>
  new AppError(401, code, message);
export const forbidden = (message: string, code: ApiErrorCode = 'forbidden') =>
  new AppError(403, code, message);
export const notFound = (message: string, code: ApiErrorCode = 'not_found') =>
  new AppError(404, code, message);
export const conflict = (code: ApiErrorCode, message: string, details?: Record<string, unknown>) =>
  new AppError(409, code, message, details);
