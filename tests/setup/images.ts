// The smallest photos the server accepts, typed by their first bytes as the server types uploads.

/** A 1x1 PNG, the smallest photo the kiosk can send. */
export const onePixelPng = Buffer.from(
  'iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==',
  'base64',
);

/** A JPEG start-of-image marker with a JFIF header, followed by the given bytes. */
export const jfifJpeg = (rest: Buffer) =>
  Buffer.concat([Buffer.from([0xff, 0xd8, 0xff, 0xe0, 0x00, 0x10]), Buffer.from('JFIF\0'), rest]);
