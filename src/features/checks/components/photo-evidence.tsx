import { useEffect, useRef, useState } from 'react';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { errorMessage } from '@/lib/api-client';
import { photoUrl, uploadPhoto } from '../api/upload-photo';
import type { PhotoRef } from '../model/check-draft';
import { Stroke } from '@/components/ui/stroke';
import { useTranslation } from 'react-i18next';

interface PhotoEvidenceProps {
  /** What the photos show, for the buttons' names ("Add photo for System 1 reservoir level"). */
  subject: string;
  photos: PhotoRef[];
  onAdd: (photo: PhotoRef) => void;
  onRemove: (id: string) => void;
}

interface Upload {
  key: number;
  preview: string;
  progress: number;
}

const maxPhotos = 6;

/** Photos of what the mechanic saw, uploaded as soon as they are taken; they join the check when it is signed. */
export function PhotoEvidence({ subject, photos, onAdd, onRemove }: PhotoEvidenceProps) {
  const { t } = useTranslation('checks');
  const [uploads, setUploads] = useState<Upload[]>([]);
  const [problem, setProblem] = useState<string | null>(null);
  const nextKey = useRef(0);
  const previews = useRef(new Set<string>());
  useEffect(() => {
    const made = previews.current;
    return () => made.forEach((url) => URL.revokeObjectURL(url));
  }, []);

  const take = (files: FileList | null) => {
    const file = files?.[0];
    if (!file) return;
    setProblem(null);
    const key = nextKey.current++;
    const preview = URL.createObjectURL(file);
    previews.current.add(preview);
    setUploads((list) => [...list, { key, preview, progress: 0 }]);
    const done = () => {
      setUploads((list) => list.filter((upload) => upload.key !== key));
      URL.revokeObjectURL(preview);
      previews.current.delete(preview);
    };
    uploadPhoto(file, (progress) =>
      setUploads((list) => list.map((upload) => (upload.key === key ? { ...upload, progress } : upload))),
    )
      .then((photo) => {
        done();
        onAdd(photo);
      })
      .catch((error: unknown) => {
        done();
        // The server's own words (not an image, too large); React renders them as text.
        setProblem(errorMessage(error));
      });
  };

  const full = photos.length + uploads.length >= maxPhotos;
  return (
    <section aria-label={t('photos.label', { subject })} className="flex flex-col gap-3">
      <div className="flex flex-wrap items-end gap-4">
        {photos.map((photo, index) => (
          <figure key={photo.id} className="flex flex-col items-center gap-2" data-testid="photo-thumb">
            <img
              src={photoUrl(photo.id)}
              alt={t('photos.photoOf', { number: index + 1, subject })}
              className="h-[120px] w-[120px] rounded-lg border-2 border-ink-line object-cover"
            />
            <Button
              tone="quiet"
              aria-label={t('photos.removeLabel', { number: index + 1, subject })}
              onClick={() => onRemove(photo.id)}
              className="w-[120px] px-2 text-[20px]"
            >
              {t('photos.remove')}
            </Button>
          </figure>
        ))}
        {uploads.map((upload) => (
          <figure key={upload.key} className="flex flex-col items-center gap-2">
            <img
              src={upload.preview}
              alt={t('photos.sendingAlt', { subject })}
              className="h-[120px] w-[120px] rounded-lg border-2 border-signal-edge object-cover opacity-70"
            />
            <div
              role="progressbar"
              aria-label={t('photos.sendingLabel', { subject })}
              aria-valuemin={0}
              aria-valuemax={100}
              aria-valuenow={Math.round(upload.progress * 100)}
              className="h-6 w-[120px] overflow-hidden rounded-full border-2 border-ink-line bg-ink"
            >
              <div
                className="h-full bg-signal-bright"
                style={{ width: `${Math.round(upload.progress * 100)}%` }}
              />
            </div>
            <span className="text-[20px] tabular">
              {t('photos.percent', { value: Math.round(upload.progress * 100) })}
            </span>
          </figure>
        ))}
        {!full && (
          // The file input itself covers the button, so a glove's tap (and a screen reader) reaches the camera directly.
          <label className="relative inline-flex min-h-touch-lg min-w-[220px] cursor-pointer items-center justify-center gap-3 rounded-xl border-2 border-ink-line bg-ink-raised px-6 text-[28px] font-semibold text-paper focus-within:outline focus-within:outline-4 focus-within:outline-signal-text active:scale-[0.97]">
            <CameraGlyph />
            {photos.length > 0 ? t('photos.addAnother') : t('photos.add')}
            <input
              type="file"
              accept="image/*"
              capture="environment"
              aria-label={t('photos.addFor', { subject })}
              data-testid="photo-input"
              className="absolute inset-0 h-full w-full cursor-pointer opacity-0"
              onChange={(event) => {
                take(event.currentTarget.files);
                event.currentTarget.value = '';
              }}
            />
          </label>
        )}
      </div>
      {problem && (
        <Notice tone="caution" title={t('photos.notAdded')}>
          {problem}
        </Notice>
      )}
    </section>
  );
}

function CameraGlyph() {
  return (
    <svg width="40" height="32" viewBox="0 0 40 32" aria-hidden>
      <Stroke d="M4 8h8l3-5h10l3 5h8v21H4Z" width={3} />
      <circle cx="20" cy="18" r="7" fill="none" stroke="currentColor" strokeWidth="3" />
    </svg>
  );
}
