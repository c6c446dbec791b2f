import type { Request } from 'express';
import type { PhotoBytes } from './signed-check-section';

/** What every printed record needs from the app: who the operator is, where the desk is, and the photo files. */
export interface PrintOptions {
  operator: string;
  /** The desk's public address; unset: the address this request came to. */
  publicBaseUrl?: string | undefined;
  photoBytes: PhotoBytes;
}

/** The absolute desk address of `path`, for the QR code on a printed record. */
export const deskUrl = (options: PrintOptions, req: Request, path: string) =>
  `${options.publicBaseUrl ?? `${req.protocol}://${req.get('host')}`}${path}`;

/** Sends a finished PDF, named for the reader ("QX-TNA pre-flight 2026-12-02.pdf"), to open in the browser. */
export function sendPdf(res: import('express').Response, bytes: Buffer, fileName: string) {
  const safe = fileName.replace(/[^A-Za-z0-9 .-]/g, '');
  res.type('application/pdf').set('Content-Disposition', `inline; filename="${safe}"`).send(bytes);
}
