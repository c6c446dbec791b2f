import { useState, type ReactNode } from 'react';
import { useTranslation } from 'react-i18next';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { QrGlyph } from '@/components/ui/qr-glyph';
import { QrScanner } from '@/components/ui/qr-scanner';
import { tagTokenFrom } from './tag-token';

interface TagScan {
  /** The "Scan tag" button; it opens the camera. */
  button: ReactNode;
  /** Why the last scan was not a tag, or nothing. */
  problem: ReactNode;
  /** The camera overlay while it is open (a fixed layer, so where it is placed does not matter). */
  scanner: ReactNode;
}

/**
 * Scanning an airframe's tag: `onTag` gets the tag's token; a QR code that is not a tag says so and
 * points to `otherwise`, the other way to find the airframe on that screen.
 */
export function useTagScan(onTag: (token: string) => void, otherwise: string, buttonClass = ''): TagScan {
  const [scanning, setScanning] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const { t } = useTranslation('airframes');
  return {
    button: (
      <Button
        tone="primary"
        size="large"
        className={buttonClass}
        onClick={() => {
          setProblem(null);
          setScanning(true);
        }}
      >
        <QrGlyph /> {t('tagScan.scan')}
      </Button>
    ),
    problem: problem && (
      <Notice tone="caution" title={t('tagScan.notATag')}>
        {problem}
      </Notice>
    ),
    scanner: scanning && (
      <QrScanner
        what={t('tagScan.what')}
        onClose={() => setScanning(false)}
        onResult={(text) => {
          setScanning(false);
          const token = tagTokenFrom(text);
          if (token) onTag(token);
          else setProblem(t('tagScan.notATagText', { otherwise }));
        }}
      />
    ),
  };
}
