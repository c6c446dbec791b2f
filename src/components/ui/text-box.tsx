import type { ReactNode } from 'react';

const sizes = {
  touch: { label: 'text-[22px]', box: 'p-3 text-[22px]' },
  large: { label: 'text-[24px]', box: 'p-4 text-[24px]' },
};

/** A labelled kiosk text area for a reason or statement; `boxClass` sets its height and line spacing. */
export function TextBox({
  label,
  value,
  onChange,
  rows,
  placeholder,
  size = 'large',
  boxClass = '',
}: {
  label: ReactNode;
  value: string;
  onChange: (text: string) => void;
  rows: number;
  placeholder?: string;
  size?: keyof typeof sizes;
  boxClass?: string;
}) {
  return (
    <label className="flex flex-col gap-2">
      <span className={`${sizes[size].label} font-semibold`}>{label}</span>
      <textarea
        rows={rows}
        value={value}
        onChange={(event) => onChange(event.target.value)}
        placeholder={placeholder}
        className={`${boxClass} w-full rounded-xl border-2 border-ink-line bg-ink ${sizes[size].box} text-paper placeholder:text-ink-muted`}
      />
    </label>
  );
}
