import { useEffect, useState } from 'react';
import QRCode from 'qrcode';

/** The enrolment URL as a QR code, to scan with the tablet's camera instead of typing it. */
export function EnrolmentQr({ url }: { url: string }) {
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
    <img src={image} width={320} height={320} alt={`QR code for ${url}`} className="rounded-lg bg-white" />
  );
}
