import { useEffect, useState } from 'react';
import QRCode from 'qrcode';

/** A link as a QR code, so a tablet's camera or a TV set up by phone opens it without typing. */
export function QrCode({ url, alt, testId }: { url: string; alt: string; testId?: string }) {
  const [image, setImage] = useState<string | null>(null);
  useEffect(() => {
    let live = true;
    QRCode.toDataURL(url, { margin: 2, width: 320, errorCorrectionLevel: 'M' })
      .then((data) => live && setImage(data))
      .catch(() => live && setImage(null));
    return () => {
      live = false;
    };
  }, [url]);
  if (!image) return null;
  return (
    <img
      src={image}
      width={320}
      height={320}
      alt={alt}
      className="rounded-lg bg-white"
      data-testid={testId}
    />
  );
}
