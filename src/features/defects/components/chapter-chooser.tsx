import { ataChapters } from '@shared/domain/authorisation';

const chapters = Object.entries(ataChapters).filter(([key]) => key !== 'all');

/** The ATA chapter of a defect, or none: glove-sized choices, the chapter's name in words. */
export function ChapterChooser({
  value,
  onChange,
}: {
  value: string | null;
  onChange: (chapter: string | null) => void;
}) {
  const option = (key: string | null, words: string) => (
    <button
      key={key ?? 'none'}
      type="button"
      role="radio"
      aria-checked={value === key}
      onClick={() => onChange(key)}
      className={`min-h-touch rounded-xl border-2 px-3 text-left text-[20px] font-semibold leading-tight ${value === key ? 'border-signal-edge bg-signal-bright text-on-fill' : 'border-ink-line bg-ink-raised text-paper'}`}
    >
      {words}
    </button>
  );
  return (
    <div className="flex flex-col gap-2">
      <span className="text-[22px] font-semibold">ATA chapter (if you know it)</span>
      <div className="grid grid-cols-3 gap-2 portrait:grid-cols-2" role="radiogroup" aria-label="ATA chapter">
        {option(null, 'Not classified')}
        {chapters.map(([key, words]) => option(key, words))}
      </div>
    </div>
  );
}
