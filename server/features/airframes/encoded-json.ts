import { createHash } from 'node:crypto';
import { promisify } from 'node:util';
import { brotliCompress, constants, gzip } from 'node:zlib';
import type { Request, Response } from 'express';

const brotli = promisify(brotliCompress);
const gzipped = promisify(gzip);
type Coding = 'br' | 'gzip';

/**
 * A JSON answer that many readers get unchanged (a board between two changes): its UTF-8 bytes and entity tag made
 * once, and a brotli or gzip copy made on the first reader that accepts it. Every tablet and hangar screen reads the
 * board every few seconds; hashing, encoding and compressing the same hundreds of kilobytes for each of them was most
 * of the board's cost. The copies are made off the event loop (zlib's thread pool).
 */
export class EncodedJson {
  readonly body: Buffer;
  readonly etag: string;
  private readonly copies = new Map<Coding, Promise<Buffer>>();

  constructor(text: string) {
    this.body = Buffer.from(text, 'utf8');
    // Weak: the brotli, gzip and plain copies carry the same tag, which a strong tag may not (RFC 9110, section 8.8.1, from memory).
    this.etag = `W/"${createHash('sha1').update(this.body).digest('base64url')}"`;
  }

  copy(coding: Coding): Promise<Buffer> {
    let found = this.copies.get(coding);
    if (!found) {
      // Brotli at quality 5: about gzip's speed with a smaller result; its default (11) takes a second on a big board.
      found =
        coding === 'br'
          ? brotli(this.body, { params: { [constants.BROTLI_PARAM_QUALITY]: 5 } })
          : gzipped(this.body);
      this.copies.set(coding, found);
    }
    return found;
  }
}

/**
 * Sends it in the coding the reader accepts. Express's own `send` answers "not modified" to a reader that sends the
 * tag back, and computes no tag of its own when one is set.
 */
export async function sendEncodedJson(req: Request, res: Response, encoded: EncodedJson): Promise<void> {
  res.type('application/json');
  res.set('ETag', encoded.etag);
  res.vary('Accept-Encoding');
  // Brotli when accepted at all (browsers list it after gzip with the same weight), else gzip, else as it is.
  const coding = (['br', 'gzip'] as const).find((c) => req.acceptsEncodings(c) === c);
  if (coding) {
    const copy = await encoded.copy(coding);
    res.set('Content-Encoding', coding);
    res.send(copy);
    return;
  }
  res.send(encoded.body);
}
