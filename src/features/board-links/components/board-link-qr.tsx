import { useEffect, useState } from 'react';
import QRCode from 'qrcode';

/** The board link as a QR code, so the TV's browser (or a phone setting it up) can open it without typing. */
export function BoardLinkQr({ url }: { url: string }) {
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
      alt={`QR code for the board link ${url}`}
      className="rounded-lg bg-white"
      data-testid="board-link-qr"
    />
  );
}
